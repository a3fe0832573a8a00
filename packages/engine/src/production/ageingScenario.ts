import type { ResistorKind } from '../values/resistorKinds.js';

/** A drift figure in percent of value: mean shift (signed: + = value rises) and its spread (1σ). */
export type DriftFigure = { shift: number; sd: number; source: string };

/**
 * An ageing scenario: resistor value drift per construction, and tube emission loss (the fraction
 * of cathode current capability lost, percent, per section, with its spread). Emission loss scales
 * each section's perveance by (1 − loss).
 *
 * @example DEFAULT_AGEING_SCENARIO.resistors['carbon-comp'].shift // 5
 */
export type AgeingScenario = {
  name: string;
  resistors: Record<ResistorKind, DriftFigure>;
  emission: DriftFigure;
};

/**
 * A service-life scenario of roughly ten years in a warm chassis. Every figure is from memory, not
 * verified against a datasheet: carbon composition is known to drift upwards by several percent
 * with heat and moisture; carbon film by around a percent; metal film by a few tenths; a dual
 * triode in a low-current stage keeps most of its emission, a worn one is commonly judged at
 * about 70 % of new.
 */
export const DEFAULT_AGEING_SCENARIO: AgeingScenario = {
  name: 'Ten years in a warm chassis',
  resistors: {
    'carbon-comp': { shift: 5, sd: 3, source: 'from memory' },
    'carbon-film': { shift: 1, sd: 0.7, source: 'from memory' },
    'metal-film': { shift: 0.2, sd: 0.15, source: 'from memory' },
  },
  emission: { shift: 15, sd: 7, source: 'from memory' },
};
