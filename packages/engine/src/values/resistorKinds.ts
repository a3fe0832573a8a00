/**
 * Resistor constructions a part can be bought in; they differ in price and in how they drift with
 * age. A part without a kind is metal film ({@link DEFAULT_RESISTOR_KIND}).
 *
 * @example RESISTOR_KINDS.includes('carbon-comp') // true
 */
export const RESISTOR_KINDS = ['metal-film', 'carbon-film', 'carbon-comp'] as const;

/** One of {@link RESISTOR_KINDS}. */
export type ResistorKind = (typeof RESISTOR_KINDS)[number];

/** The kind of a resistor part that does not name one. */
export const DEFAULT_RESISTOR_KIND: ResistorKind = 'metal-film';
