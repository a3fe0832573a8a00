import { H1_IM, H1_RE, H2_IM, H2_RE, type AcSolver } from './acResponse.js';

/** Lowest and highest frequencies (Hz) the corner search looks at; beyond them it gives 0 / Infinity. */
export const CORNER_F_MIN = 1e-3;
export const CORNER_F_MAX = 1e9;
const X_MIN = Math.log10(CORNER_F_MIN);
const X_MAX = Math.log10(CORNER_F_MAX);
const HALF = Math.log(0.5);
/** The search ends when the bracket is this narrow (decades): ~2e-8 relative in frequency. */
const X_TOL = 1e-8;

/** Secant steps at most before falling back to the bracketed search. */
const SECANT_STEPS = 8;
/** Largest distance (decades) the secant may wander from its start before the fallback. */
const SECANT_REACH = 1;
/** The secant ends when its step is this small (decades); the superlinear last step leaves the
 * error far below it (the kernel test checks |H|² at the corner to 1e-5). */
const SECANT_TOL = 1e-5;

/**
 * The −3 dB frequency (Hz) of output `which` (1 or 2) on one side of midband: where
 * |H(f)|² = |ref|²/2, ref being the midband gain. With a known `slope` (d/d log10 f of
 * ln|H|² at a nearby corner, e.g. the nominal one; per-sample warm start), a secant from `start`
 * whose first step uses that slope: 3–5 solves for a sample near nominal. Without one (slope 0),
 * or when the secant strays, a bracketed search: walk outwards from `start` (a frequency inside
 * the band, or a nearby corner) with growing steps until the response crosses −3 dB, then
 * Illinois regula falsi on log f. Returns 0 (low side) or Infinity (high side) when the response
 * stays within 3 dB down to CORNER_F_MIN or up to CORNER_F_MAX, NaN if a solve fails.
 * `solve` is the topology's response (pairAcSolver, splitLoadResponseArr). Allocation-free (`h` as
 * for acResponseArr).
 *
 * @example
 * cornerFrequencyArr(pairAcSolver(true, false), v, 1, Math.abs(a11), 'high', 1000, 0, h); // e.g. 48e3 (Hz)
 */
export function cornerFrequencyArr(
  solve: AcSolver,
  v: Float64Array,
  which: 1 | 2,
  ref: number,
  side: 'low' | 'high',
  start: number,
  slope: number,
  h: Float64Array,
): number {
  const lnRef2 = Math.log(ref * ref);
  const xs = Math.log10(start);
  if (slope !== 0 && Number.isFinite(slope)) {
    let x0 = xs;
    let g0 = g(solve, v, which, lnRef2, x0, h);
    let x1 = x0 - g0 / slope;
    for (let it = 0; it < SECANT_STEPS && Math.abs(x1 - xs) < SECANT_REACH; it++) {
      const g1 = g(solve, v, which, lnRef2, x1, h);
      if (Number.isNaN(g1) || g1 === g0) break;
      const x2 = x1 - (g1 * (x1 - x0)) / (g1 - g0);
      if (Math.abs(x2 - x1) < SECANT_TOL) return Math.pow(10, x2);
      x0 = x1;
      g0 = g1;
      x1 = x2;
    }
  }
  return bracketedCorner(solve, v, which, lnRef2, side, xs, h);
}

/**
 * d/d log10 f of ln|H(f)|² for output `which` at f (central difference), the warm-start slope
 * of {@link cornerFrequencyArr}.
 *
 * @example
 * cornerSlopeArr(pairAcSolver(true, false), v, 1, 48e3, h); // ≈ −4.6 beyond a single pole
 */
export function cornerSlopeArr(
  solve: AcSolver,
  v: Float64Array,
  which: 1 | 2,
  f: number,
  h: Float64Array,
): number {
  const x = Math.log10(f);
  const d = 1e-4;
  const up = g(solve, v, which, 0, x + d, h);
  const down = g(solve, v, which, 0, x - d, h);
  return (up - down) / (2 * d);
}

function bracketedCorner(
  solve: AcSolver,
  v: Float64Array,
  which: 1 | 2,
  lnRef2: number,
  side: 'low' | 'high',
  xs: number,
  h: Float64Array,
): number {
  const dir = side === 'high' ? 1 : -1;
  let x0 = xs;
  let g0 = g(solve, v, which, lnRef2, x0, h);
  if (Number.isNaN(g0)) return Number.NaN;
  // Walk: outwards while inside the band, inwards while outside, until the sign changes.
  let d = g0 >= 0 ? dir * 0.3 : -dir * 0.3;
  let x1: number;
  let g1: number;
  for (;;) {
    x1 = x0 + d;
    if (x1 > X_MAX) return side === 'high' ? Number.POSITIVE_INFINITY : Number.NaN;
    if (x1 < X_MIN) return side === 'low' ? 0 : Number.NaN;
    g1 = g(solve, v, which, lnRef2, x1, h);
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
    const gx = g(solve, v, which, lnRef2, x, h);
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
  solve: AcSolver,
  v: Float64Array,
  which: 1 | 2,
  lnRef2: number,
  x: number,
  h: Float64Array,
): number {
  if (!solve(v, Math.pow(10, x), h)) return Number.NaN;
  const re = which === 1 ? h[H1_RE] : h[H2_RE];
  const im = which === 1 ? h[H1_IM] : h[H2_IM];
  return Math.log(re * re + im * im) - lnRef2 - HALF;
}

/**
 * The per-sample corner searches' start points: the nominal −3 dB points [fLow1, fLow2, fHigh1,
 * fHigh2] (Hz) by a bracketed search from 1 kHz, then the response slope at each (the secant's
 * first step; 0 = none). A corner that does not exist at nominal is replaced by 1 kHz with slope
 * 0 (a start point must be finite). `v` holds the nominal circuit; ref1, ref2 the midband gains.
 *
 * @example
 * nominalCornerStarts(splitLoadResponseArr, v, 0.9, 0.9, h); // Float64Array(8)
 */
export function nominalCornerStarts(
  solve: AcSolver,
  v: Float64Array,
  ref1: number,
  ref2: number,
  h: Float64Array,
): Float64Array {
  const out = Float64Array.of(1e3, 1e3, 1e3, 1e3, 0, 0, 0, 0);
  for (let i = 0; i < 4; i++) {
    const which = i % 2 === 0 ? 1 : 2;
    const ref = which === 1 ? ref1 : ref2;
    const f = cornerFrequencyArr(solve, v, which, ref, i < 2 ? 'low' : 'high', 1e3, 0, h);
    if (Number.isFinite(f) && f > 0) {
      out[i] = f;
      out[i + 4] = cornerSlopeArr(solve, v, which, f, h);
    }
  }
  return out;
}
