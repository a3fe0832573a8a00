/** E-series names of IEC 60063. */
export type ESeriesName = 'E12' | 'E24' | 'E48' | 'E96' | 'E192';

// IEC 60063 tables (mantissas in one decade). E12 and E24 are two-digit; E48, E96 and E192 are
// three-digit and nested (E96 = every second E192 value, E48 = every second E96 value).
const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8,
  7.5, 8.2, 9.1,
];
const E192_HUNDREDS = [
  100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126, 127,
  129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158, 160, 162, 164,
  165, 167, 169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203, 205, 208, 210,
  213, 215, 218, 221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258, 261, 264, 267, 271,
  274, 277, 280, 284, 287, 291, 294, 298, 301, 305, 309, 312, 316, 320, 324, 328, 332, 336, 340, 344, 348,
  352, 357, 361, 365, 370, 374, 379, 383, 388, 392, 397, 402, 407, 412, 417, 422, 427, 432, 437, 442, 448,
  453, 459, 464, 470, 475, 481, 487, 493, 499, 505, 511, 517, 523, 530, 536, 542, 549, 556, 562, 569, 576,
  583, 590, 597, 604, 612, 619, 626, 634, 642, 649, 657, 665, 673, 681, 690, 698, 706, 715, 723, 732, 741,
  750, 759, 768, 777, 787, 796, 806, 816, 825, 835, 845, 856, 866, 876, 887, 898, 909, 920, 931, 942, 953,
  965, 976, 988,
];
const E192 = E192_HUNDREDS.map((v) => v / 100);
const E96 = E192.filter((_, i) => i % 2 === 0);
const E48 = E96.filter((_, i) => i % 2 === 0);
const E12 = E24.filter((_, i) => i % 2 === 0);

/**
 * IEC 60063 preferred-number mantissas for one decade, [1, 10), ascending.
 *
 * @example
 * E_SERIES.E24.includes(4.7); // true
 */
export const E_SERIES: Readonly<Record<ESeriesName, readonly number[]>> = { E12, E24, E48, E96, E192 };

function decadeValue(mantissa: number, exp: number): number {
  return Number((mantissa * 10 ** exp).toPrecision(3));
}

/**
 * The series values just below-or-equal and just above-or-equal to `value` (same value twice when
 * it is in the series). Ohms (or any unit) in and out.
 *
 * @example
 * eSeriesNeighbours(4800, 'E24'); // { below: 4700, above: 5100 }
 */
export function eSeriesNeighbours(value: number, series: ESeriesName): { below: number; above: number } {
  if (!(value > 0) || !Number.isFinite(value)) throw new Error(`not a positive value: ${value}`);
  const list = E_SERIES[series];
  let exp = Math.floor(Math.log10(value));
  // Guard log10 rounding at decade edges (log10(1000) may come out as 2.9999999999999996).
  if (decadeValue(1, exp + 1) <= value) exp += 1;
  let below = decadeValue(list[list.length - 1], exp - 1);
  let above = decadeValue(1, exp + 1);
  for (const m of list) {
    const v = decadeValue(m, exp);
    if (v <= value) below = v;
    if (v >= value) {
      above = v;
      break;
    }
  }
  return { below, above };
}

/**
 * The series value nearest to `value` on a logarithmic scale (ratio distance), as preferred
 * numbers are spaced geometrically (IEC 60063).
 *
 * @example
 * snapToSeries(4800, 'E24'); // 4700
 */
export function snapToSeries(value: number, series: ESeriesName): number {
  const { below, above } = eSeriesNeighbours(value, series);
  return value / below <= above / value ? below : above;
}
