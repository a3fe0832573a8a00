import { korenPointArr } from '../tubes/korenTriode.js';
import {
  CUTOFF_CURRENT,
  GRID_CURRENT_VGK,
  MIN_PLATE_VOLTAGE,
  type BiasCircuit,
  type BiasPoint,
  type BiasStatus,
} from './biasSolver.js';

/**
 * Scratch of the solve (korenPointArr layout: Vpk, Vgk, scale, mu scale, then Ia, gm, ga), so the
 * per-sample path allocates nothing and boxes no doubles.
 */
const T = new Float64Array(8);

/** Evaluates the section at plate current ia into T and the node voltages into bp. */
function evalAt(c: BiasCircuit, bp: BiasPoint, ia: number): void {
  const vj = c.tail + ia * c.rt;
  const vk = vj + ia * c.rk;
  bp.vj = vj;
  bp.vk = vk;
  bp.va1 = c.bPlus - ia * c.rl1;
  bp.vgk1 = vj - vk;
  T[0] = bp.va1 - vk;
  T[1] = bp.vgk1;
  T[2] = c.perv1;
  T[3] = c.muScale1;
  korenPointArr(c.tube, T, 0);
}

/**
 * DC operating point of the split-load (cathodyne) splitter: one triode section (section 1 of the
 * circuit), plate load `rl1` to B+, bias resistor `rk` from the cathode to the grid-return point J,
 * cathode load `rt` from J to the tail supply (0 V for the usual form), grid leak to J (no grid
 * current, so Vg = VJ). With the plate current Ia:
 *   VJ = tail + Ia·Rt,  Vk = VJ + Ia·Rk,  Va = B+ − Ia·RL,  Vgk = −Ia·Rk,
 * and F(Ia) = Ia − Ip(Va − Vk, Vgk) = 0, Ip the Koren current. F increases with Ia (Ip falls as
 * Ia rises: both Vpk and Vgk fall), so the root in [0, Imax = (B+ − tail)/(RL + Rk + Rt)] is
 * unique: safeguarded Newton (slope 1 + ga·(RL + Rk + Rt) + gm·Rk), falling back to bisection
 * when a step leaves the bracket. Writes section 1's fields of `bp`; section 2's are NaN.
 * `rl2`, `rg2` and section 2's multipliers are not read.
 *
 * @example
 * const bp = createBiasPoint();
 * solveSplitLoadBiasInto(circuit, bp, false); // 'ok'; bp.ia1 ≈ 4.0e-3 A for the 12AU7 example
 */
export function solveSplitLoadBiasInto(
  c: BiasCircuit,
  bp: BiasPoint,
  warm: boolean,
  stepTol = 1e-12,
): BiasStatus {
  bp.ia2 = bp.va2 = bp.vgk2 = bp.gm2 = bp.ga2 = Number.NaN;
  if (!(
    c.rl1 > 0 &&
    c.rk >= 0 &&
    c.rt > 0 &&
    c.perv1 > 0 &&
    c.muScale1 > 0 &&
    c.rl1 + c.rk + c.rt < Infinity
  )) {
    return fail(bp, 'invalid-parts');
  }
  if (!(c.bPlus - c.tail > 0) || !(c.bPlus > 0)) return fail(bp, 'supply-too-low');
  const rsum = c.rl1 + c.rk + c.rt;
  const max = (c.bPlus - c.tail) / rsum;
  let lo = 0;
  let hi = max;
  let x = warm && bp.ia1 > 0 && bp.ia1 < max ? bp.ia1 : 0.3 * max;
  for (let it = 1; it <= 200; it++) {
    evalAt(c, bp, x);
    const f = x - T[4];
    if (f > 0) hi = x;
    else lo = x;
    const slope = 1 + T[6] * rsum + T[5] * c.rk;
    const d = f / slope;
    // Converged: the Newton update is below stepTol of the current (quadratic convergence makes
    // the updated current good to ~stepTol²), so take it as is.
    if (Math.abs(d) <= stepTol * x + 1e-18) return finish(c, bp, x - d, it);
    if (hi - lo <= 1e-15 * hi) return finish(c, bp, 0.5 * (lo + hi), it);
    const next = x - d;
    x = next > lo && next < hi ? next : 0.5 * (lo + hi);
  }
  return finish(c, bp, x, 200, 'no-convergence');
}

function fail(bp: BiasPoint, status: BiasStatus): BiasStatus {
  bp.status = status;
  bp.iterations = 0;
  bp.ia1 = bp.gm1 = bp.ga1 = Number.NaN;
  return status;
}

/** Records the point at plate current ia (gm, rp from the evaluation there) and classifies it. */
function finish(
  c: BiasCircuit,
  bp: BiasPoint,
  ia: number,
  it: number,
  status: BiasStatus = 'ok',
): BiasStatus {
  evalAt(c, bp, ia);
  bp.ia1 = ia;
  bp.gm1 = T[5];
  bp.ga1 = T[6];
  bp.iterations = it;
  bp.status = status;
  if (status !== 'ok') return status;
  if (bp.vgk1 > GRID_CURRENT_VGK) bp.status = 'grid-current';
  else if (ia < CUTOFF_CURRENT) bp.status = 'cut-off';
  else if (bp.va1 - bp.vk < MIN_PLATE_VOLTAGE) bp.status = 'supply-too-low';
  return bp.status;
}
