/**
 * Dual triodes the catalog knows. The design document's `tube.type` must be one of these.
 *
 * @example
 * TUBE_TYPES.includes('12AX7'); // true
 */
export const TUBE_TYPES = ['12AX7', '12AT7', '12AU7', '12AY7', '12BH7', '6SN7'] as const;

/** One of {@link TUBE_TYPES}. */
export type TubeType = (typeof TUBE_TYPES)[number];
