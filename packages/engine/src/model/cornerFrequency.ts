import { acResponseArr, H1_IM, H1_RE, H2_IM, H2_RE } from './acResponse.js';

/** Lowest and highest frequencies (Hz) the corner search looks at; beyond them it gives 0 / Infinity. */
export const CORNER_F_MIN = 1e-3;
export const CORNER_F_MAX = 1e9;
const X_MIN = Math.log10(CORNER_F_MIN);
const X_MAX = Math.log10(CORNER_F_MAX);
const HALF = Math.log(0.5);
/** The search ends when the bracket is this narrow (decades): ~2e-8 relative in frequency. */
const X_TOL = 1e-8;

/**
 * The −3 dB frequency (Hz) of output `which` (1 or 2) on one side of midband: where
 * |H(f)|² = |ref|²/2, ref being the midband gain. Starts at `start` Hz (a frequency inside the
 * band on the side's inner edge, or a previous corner to warm-start from), walks outwards with
 * growing steps (`step` decades first) until the response crosses −3 dB, then closes the bracket
 * by regula falsi (Illinois) on log f. Returns 0 (low side) or Infinity (high side) when the
 * response stays within 3 dB down to CORNER_F_MIN or up to CORNER_F_MAX, NaN if a solve fails.
 * Allocation-free (scratch `w`, `h` as for acResponseArr).
 *
 * @example
 * cornerFrequencyArr(true, false, v, 1, a11, 'high', 1000, 0.3, w, h); // e.g. 48e3 (Hz)
 */
export function cornerFrequencyArr(
  capCoupled: boolean,
  leakToGrid1: boolean,
  v: Float64Array,
  which: 1 | 2,
  ref: number,
  side: 'low' | 'high',
  start: number,
  step: number,
  w: Float64Array,
  h: Float64Array,
): number {
  const lnRef2 = Math.log(ref * ref);
  const dir = side === 'high' ? 1 : -1;
  let x0 = Math.log10(start);
  let g0 = g(capCoupled, leakToGrid1, v, which, lnRef2, x0, w, h);
  if (Number.isNaN(g0)) return Number.NaN;
  // Walk: outwards while inside the band, inwards while outside, until the sign changes.
  let d = g0 >= 0 ? dir * step : -dir * step;
  let x1: number;
  let g1: number;
  for (;;) {
    x1 = x0 + d;
    if (x1 > X_MAX) return side === 'high' ? Number.POSITIVE_INFINITY : Number.NaN;
    if (x1 < X_MIN) return side === 'low' ? 0 : Number.NaN;
    g1 = g(capCoupled, leakToGrid1, v, which, lnRef2, x1, w, h);
    if (Number.isNaN(g1)) return Number.NaN;
    if (g1 >= 0 !== g0 >= 0) break;
    x0 = x1;
    g0 = g1;
    d *= 2;
  }
  // Illinois: regula falsi that halves the retained end's value when the new point lands on the
  // same side as the last one, so both ends of the bracket keep moving.
  for (let it = 0; it < 60 && Math.abs(x1 - x0) > X_TOL; it++) {
    const x = x1 - (g1 * (x1 - x0)) / (g1 - g0);
    const gx = g(capCoupled, leakToGrid1, v, which, lnRef2, x, w, h);
    if (Number.isNaN(gx)) return Number.NaN;
    if (gx === 0) return Math.pow(10, x);
    if (gx >= 0 !== g1 >= 0) {
      x0 = x1;
      g0 = g1;
    } else g0 *= 0.5;
    x1 = x;
    g1 = gx;
  }
  return Math.pow(10, x1);
}

/** ln(|H(10^x)|² / |ref|²) − ln ½ for output `which`: positive inside the band, negative outside. */
function g(
  capCoupled: boolean,
  leakToGrid1: boolean,
  v: Float64Array,
  which: 1 | 2,
  lnRef2: number,
  x: number,
  w: Float64Array,
  h: Float64Array,
): number {
  if (!acResponseArr(capCoupled, leakToGrid1, v, Math.pow(10, x), w, h)) return Number.NaN;
  const re = which === 1 ? h[H1_RE] : h[H2_RE];
  const im = which === 1 ? h[H1_IM] : h[H2_IM];
  return Math.log(re * re + im * im) - lnRef2 - HALF;
}
