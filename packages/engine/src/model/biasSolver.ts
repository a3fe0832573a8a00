import { korenPointArr, type KorenParams } from '../tubes/korenTriode.js';

/** Why a bias point is not usable. 'ok' means a valid point was found. */
export type BiasStatus =
  | 'ok'
  | 'supply-too-low'
  | 'cut-off'
  | 'grid-current'
  | 'no-convergence'
  /** A resistance or tube multiplier is zero, negative or not a number (a sampled value gone wild). */
  | 'invalid-parts';

/** The DC circuit for one sample (volts, ohms; multipliers dimensionless). */
export interface BiasCircuit {
  /** true: both grids returned to J (Vg = VJ); false: grids at fixed DC voltages vg1, vg2. */
  capCoupled: boolean;
  bPlus: number;
  /** Bottom of Rt (V): 0 or a negative tail supply. */
  tail: number;
  /** Grid DC voltages to ground, direct-coupled only (V). */
  vg1: number;
  vg2: number;
  rl1: number;
  rl2: number;
  rk: number;
  rt: number;
  tube: KorenParams;
  /** Plate-current scale and mu multipliers per section (nominal 1). */
  perv1: number;
  perv2: number;
  muScale1: number;
  muScale2: number;
}

/** Solved bias point, written in place (A, V, S). `ga` is 1/rp. */
export interface BiasPoint {
  status: BiasStatus;
  ia1: number;
  ia2: number;
  va1: number;
  va2: number;
  vk: number;
  vj: number;
  vgk1: number;
  vgk2: number;
  gm1: number;
  gm2: number;
  ga1: number;
  ga2: number;
  iterations: number;
}

/**
 * Below this plate current (A) a section counts as cut off (common practice, no source).
 *
 * @example
 * bp.ia2 < CUTOFF_CURRENT; // section 2 is cut off
 */
export const CUTOFF_CURRENT = 1e-6;
/**
 * Plate-to-cathode voltage (V) below which a section counts as bottomed out: B+ is too low for its
 * load resistor and the triode model no longer describes it (common practice, no source).
 *
 * @example
 * bp.va1 - bp.vk < MIN_PLATE_VOLTAGE; // plate 1 bottomed out
 */
export const MIN_PLATE_VOLTAGE = 1;

/**
 * Grid-to-cathode voltage above which grid current flows and the model no longer holds (V).
 *
 * @example
 * bp.vgk1 > GRID_CURRENT_VGK; // grid 1 would draw current
 */
export const GRID_CURRENT_VGK = 0;

/**
 * A fresh, empty bias point to pass to {@link solveBiasInto}.
 *
 * @example
 * const bp = createBiasPoint();
 */
export function createBiasPoint(): BiasPoint {
  return {
    status: 'no-convergence',
    ...{ ia1: 0, ia2: 0, va1: 0, va2: 0, vk: 0, vj: 0, vgk1: 0, vgk2: 0 },
    ...{ gm1: 0, gm2: 0, ga1: 0, ga2: 0, iterations: 0 },
  };
}

/**
 * Scratch of the solve. Per-sample doubles travel through these slots, not through arguments,
 * return values or object fields: a double passed to or returned from a call the optimiser does
 * not inline is boxed (a heap number per call). T: the two sections' triode evaluations
 * (korenPointArr layout: Vpk, Vgk, scale, mu scale, then Ia, gm, ga), section 1 from 0, section 2
 * from 8. X: the plate currents (A) handed to evalAt and finish.
 */
const T = new Float64Array(16);
const X = new Float64Array(2);
const S1 = 0;
const S2 = 8;
const IA1 = S1 + 4;
const GM1 = S1 + 5;
const GA1 = S1 + 6;
const IA2 = S2 + 4;
const GM2 = S2 + 5;
const GA2 = S2 + 6;

/** Evaluates both sections at the currents (X[0], X[1]) into T and the voltages into bp. */
function evalAt(c: BiasCircuit, bp: BiasPoint): void {
  const ia1 = X[0];
  const ia2 = X[1];
  const i = ia1 + ia2;
  const vj = c.tail + i * c.rt;
  const vk = vj + i * c.rk;
  const vg1 = c.capCoupled ? vj : c.vg1;
  const vg2 = c.capCoupled ? vj : c.vg2;
  bp.vj = vj;
  bp.vk = vk;
  bp.va1 = c.bPlus - ia1 * c.rl1;
  bp.va2 = c.bPlus - ia2 * c.rl2;
  bp.vgk1 = vg1 - vk;
  bp.vgk2 = vg2 - vk;
  T[S1] = bp.va1 - vk;
  T[S1 + 1] = bp.vgk1;
  T[S1 + 2] = c.perv1;
  T[S1 + 3] = c.muScale1;
  T[S2] = bp.va2 - vk;
  T[S2 + 1] = bp.vgk2;
  T[S2 + 2] = c.perv2;
  T[S2 + 3] = c.muScale2;
  korenPointArr(c.tube, T, S1);
  korenPointArr(c.tube, T, S2);
}

/**
 * Solves the DC operating point for both plate currents at once: grid currents are zero, so
 * F_i(Ia1, Ia2) = Ia_i − Ip_i(Va_i − Vk, Vgk_i) = 0 with Vk = tail + (Ia1 + Ia2)·(Rk + Rt).
 * Damped Newton on the 2×2 system (analytic Jacobian from gm and 1/rp), started from `bp`'s
 * currents when `warm` is set; if Newton stalls, a nested bisection (each F_i is monotone in its own
 * current, so the brackets [0, Imax] always hold a root) finds the point. Writes into `bp`,
 * allocates nothing, and returns the status; a non-'ok' status names why there is no valid bias.
 * `stepTol` is the relative Newton step at which the point counts as solved (default 1e-12).
 *
 * @example
 * const bp = createBiasPoint();
 * solveBiasInto(circuit, bp, false); // 'ok'; bp.ia1 ≈ 1.3e-3 A for the guitar example's 12AX7 pair
 */
export function solveBiasInto(c: BiasCircuit, bp: BiasPoint, warm: boolean, stepTol = 1e-12): BiasStatus {
  const refused = refuseCircuit(c, bp);
  if (refused !== null) return refused;
  const span = c.bPlus - c.tail;
  const rkk = c.rk + c.rt;
  const rg = c.capCoupled ? c.rk : rkk;
  const max1 = span / (c.rl1 + rkk);
  const max2 = span / (c.rl2 + rkk);
  let x1 = warm && bp.ia1 > 0 && bp.ia1 < max1 ? bp.ia1 : 0.3 * max1;
  let x2 = warm && bp.ia2 > 0 && bp.ia2 < max2 ? bp.ia2 : 0.3 * max2;
  X[0] = x1;
  X[1] = x2;
  evalAt(c, bp);
  let f1 = x1 - T[IA1];
  let f2 = x2 - T[IA2];
  let norm = Math.abs(f1) + Math.abs(f2);
  for (let it = 1; it <= 60; it++) {
    const j11 = 1 + T[GA1] * (c.rl1 + rkk) + T[GM1] * rg;
    const j12 = T[GA1] * rkk + T[GM1] * rg;
    const j21 = T[GA2] * rkk + T[GM2] * rg;
    const j22 = 1 + T[GA2] * (c.rl2 + rkk) + T[GM2] * rg;
    const det = j11 * j22 - j12 * j21;
    const d1 = (f1 * j22 - f2 * j12) / det;
    const d2 = (j11 * f2 - j21 * f1) / det;
    // Converged: the Newton update is below stepTol of the current, so take it without another
    // model evaluation. Newton is quadratic here, so the updated currents are good to ~stepTol²;
    // gm and rp come from the last evaluation and are off by a relative ~stepTol at most. The
    // kernel passes 1e-6 (far below any part tolerance; saves one evaluation per sample).
    if (Math.abs(d1) <= stepTol * x1 + 1e-18 && Math.abs(d2) <= stepTol * x2 + 1e-18) {
      X[0] = x1 - d1;
      X[1] = x2 - d2;
      return finish(c, bp, 'ok', it);
    }
    // Backtracking on |F1| + |F2|: the Newton direction always descends it (F is monotone), so
    // this cannot cycle the way a bare Newton step does between cut-off and saturation.
    let t = 1;
    let n1 = x1;
    let n2 = x2;
    for (let k = 0; k < 40; k++) {
      n1 = x1 - t * d1;
      n2 = x2 - t * d2;
      // Stay inside the physical box [0, Imax]: halve the way to a bound instead of crossing it.
      if (n1 < 0) n1 = 0.5 * x1;
      else if (n1 > max1) n1 = 0.5 * (x1 + max1);
      if (n2 < 0) n2 = 0.5 * x2;
      else if (n2 > max2) n2 = 0.5 * (x2 + max2);
      X[0] = n1;
      X[1] = n2;
      evalAt(c, bp);
      f1 = n1 - T[IA1];
      f2 = n2 - T[IA2];
      if (Math.abs(f1) + Math.abs(f2) <= (1 - 1e-4 * t) * norm) break;
      t *= 0.5;
    }
    norm = Math.abs(f1) + Math.abs(f2);
    x1 = n1;
    x2 = n2;
    if (norm <= 1e-15 * (x1 + x2)) {
      X[0] = T[IA1];
      X[1] = T[IA2];
      return finish(c, bp, 'ok', it);
    }
  }
  return bisect(c, bp, max1, max2);
}

/** Ia1 that zeroes F1 for a given Ia2 (F1 increases with Ia1). */
function innerIa1(c: BiasCircuit, bp: BiasPoint, ia2: number, max1: number): number {
  let lo = 0;
  let hi = max1;
  for (let k = 0; k < 80 && hi - lo > 1e-15 * hi; k++) {
    const m = 0.5 * (lo + hi);
    X[0] = m;
    X[1] = ia2;
    evalAt(c, bp);
    if (m - T[IA1] > 0) hi = m;
    else lo = m;
  }
  return 0.5 * (lo + hi);
}

/**
 * The bracketing solve alone (the fallback of {@link solveBiasInto}): nested bisection on
 * Ia2 ∈ [0, Imax2] with Ia1 ∈ [0, Imax1] solved inside, each F_i being monotone in its own current.
 * Slow (thousands of model evaluations) but cannot diverge; exported so tests can hold Newton to it.
 *
 * @example
 * solveBiasBracketedInto(circuit, createBiasPoint()); // same point as solveBiasInto
 */
export function solveBiasBracketedInto(c: BiasCircuit, bp: BiasPoint): BiasStatus {
  const refused = refuseCircuit(c, bp);
  if (refused !== null) return refused;
  const span = c.bPlus - c.tail;
  const rkk = c.rk + c.rt;
  return bisect(c, bp, span / (c.rl1 + rkk), span / (c.rl2 + rkk));
}

function bisect(c: BiasCircuit, bp: BiasPoint, max1: number, max2: number): BiasStatus {
  let lo = 0;
  let hi = max2;
  for (let k = 0; k < 80 && hi - lo > 1e-15 * hi; k++) {
    const m = 0.5 * (lo + hi);
    const x1 = innerIa1(c, bp, m, max1);
    X[0] = x1;
    X[1] = m;
    evalAt(c, bp);
    if (m - T[IA2] > 0) hi = m;
    else lo = m;
  }
  const x2 = 0.5 * (lo + hi);
  const x1 = innerIa1(c, bp, x2, max1);
  X[0] = x1;
  X[1] = x2;
  evalAt(c, bp);
  const ok = Math.abs(x1 - T[IA1]) <= 1e-9 * (x1 + 1e-9) && Math.abs(x2 - T[IA2]) <= 1e-9 * (x2 + 1e-9);
  X[0] = T[IA1];
  X[1] = T[IA2];
  return finish(c, bp, ok ? 'ok' : 'no-convergence', 999);
}

/** Resistances positive (Rk may be 0) and finite, multipliers positive; NaN fails every test. */
/** The diagnosis for a circuit no solve can bias (bad parts, no supply span), else null. */
function refuseCircuit(c: BiasCircuit, bp: BiasPoint): BiasStatus | null {
  if (!partsValid(c)) {
    X[0] = 0;
    X[1] = 0;
    return finish(c, bp, 'invalid-parts', 0);
  }
  if (!(c.bPlus - c.tail > 0) || !(c.bPlus > 0)) {
    X[0] = 0;
    X[1] = 0;
    return finish(c, bp, 'supply-too-low', 0);
  }
  return null;
}

function partsValid(c: BiasCircuit): boolean {
  return (
    c.rl1 > 0 &&
    c.rl2 > 0 &&
    c.rk >= 0 &&
    c.rt > 0 &&
    c.perv1 > 0 &&
    c.perv2 > 0 &&
    c.muScale1 > 0 &&
    c.muScale2 > 0 &&
    c.rl1 + c.rl2 + c.rk + c.rt < Number.POSITIVE_INFINITY
  );
}

function classify(bp: BiasPoint): BiasStatus {
  if (bp.vgk1 > GRID_CURRENT_VGK || bp.vgk2 > GRID_CURRENT_VGK) return 'grid-current';
  if (bp.ia1 < CUTOFF_CURRENT || bp.ia2 < CUTOFF_CURRENT) return 'cut-off';
  if (bp.va1 - bp.vk < MIN_PLATE_VOLTAGE || bp.va2 - bp.vk < MIN_PLATE_VOLTAGE) return 'supply-too-low';
  return 'ok';
}

/**
 * Records the result: voltages recomputed for the final currents (X[0], X[1]) (gm, rp from the last
 * evaluation); a converged ('ok') point is then classified (grid current, cut-off, bottomed plate).
 */
function finish(c: BiasCircuit, bp: BiasPoint, status: BiasStatus, it: number): BiasStatus {
  const ia1 = X[0];
  const ia2 = X[1];
  bp.status = status;
  bp.iterations = it;
  if (status === 'supply-too-low' || status === 'invalid-parts') {
    bp.ia1 = bp.ia2 = bp.gm1 = bp.gm2 = bp.ga1 = bp.ga2 = Number.NaN;
    return status;
  }
  bp.ia1 = ia1;
  bp.ia2 = ia2;
  const i = ia1 + ia2;
  bp.vj = c.tail + i * c.rt;
  bp.vk = bp.vj + i * c.rk;
  bp.va1 = c.bPlus - ia1 * c.rl1;
  bp.va2 = c.bPlus - ia2 * c.rl2;
  bp.vgk1 = (c.capCoupled ? bp.vj : c.vg1) - bp.vk;
  bp.vgk2 = (c.capCoupled ? bp.vj : c.vg2) - bp.vk;
  bp.gm1 = T[GM1];
  bp.gm2 = T[GM2];
  bp.ga1 = T[GA1];
  bp.ga2 = T[GA2];
  if (status === 'ok') bp.status = classify(bp);
  return bp.status;
}
