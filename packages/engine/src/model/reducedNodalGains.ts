import type { StageGains } from './closedFormGains.js';

/** The small-signal circuit of one sample (Ω; mu dimensionless). Infinity = part absent. */
export interface SmallSignalCircuit {
  /** Grid leaks return to J (cap-coupled). */
  capCoupled: boolean;
  /** Direct-coupled with grid 2 tied to grid 1 through RG2 (RG2 then runs G1–G2). */
  leakToGrid1: boolean;
  mu1: number;
  mu2: number;
  rp1: number;
  rp2: number;
  rl1: number;
  rl2: number;
  rk: number;
  rt: number;
  rg1: number;
  rg2: number;
  rload1: number;
  rload2: number;
  /** Source resistance in series with the grid-1 drive (0 = ideal source). */
  rsource: number;
}

/**
 * Exact midband gains by the node equations reduced by hand to three unknowns (Vk, VJ, Vg1).
 * Grids draw no current, so each plate current is i = (mu·vg − (mu+1)·vk)/(rp + RL∥Rload) and the
 * plate nodes drop out. Handles RG1, RG2, Rload1/2, source resistance and unequal sections;
 * grid 2 is driven from an ideal source (bypassed for AC when used as the second input).
 * Zout_i: inputs zeroed, load i removed, unit current into plate i. Zin: grid 1 driven directly.
 * Writes into `out`, allocates nothing.
 *
 * @example
 * reducedNodalGainsInto(circuit, createStageGains()).a12;
 */
export function reducedNodalGainsInto(c: SmallSignalCircuit, out: StageGains): StageGains {
  const rle1 = par(c.rl1, c.rload1);
  const rle2 = par(c.rl2, c.rload2);
  const gk = 1 / c.rk;
  const gt = 1 / c.rt;
  const g1 = c.capCoupled ? 1 / c.rg1 : 0;
  const g2 = c.capCoupled ? 1 / c.rg2 : 0;
  const gl = !c.capCoupled && c.leakToGrid1 ? 1 / c.rg2 : 0;
  const ideal = !(c.rsource > 0);
  const gs = ideal ? 0 : 1 / c.rsource;
  const a1 = (c.mu1 + 1) / (c.rp1 + rle1);
  const b1 = c.mu1 / (c.rp1 + rle1);
  const a2 = (c.mu2 + 1) / (c.rp2 + rle2);
  const b2 = c.mu2 / (c.rp2 + rle2);
  // Node equations in (Vk, VJ, Vg1), one matrix for both drives:
  //   K:  (a1 + a2 + Gk)·Vk − Gk·VJ − b1·Vg1 = b2·vg2
  //   J:  −Gk·Vk + (Gk + Gt + g1 + g2)·VJ − g1·Vg1 = g2·vg2
  //   G1: −g1·VJ + (gs + g1 + gl)·Vg1 = gs·vs + gl·vg2      (or Vg1 = vs for an ideal source)
  const m11 = a1 + a2 + gk;
  const m12 = -gk;
  const m13 = -b1;
  const m21 = -gk;
  const m22 = gk + gt + g1 + g2;
  const m23 = -g1;
  const m32 = ideal ? 0 : -g1;
  const m33 = ideal ? 1 : gs + g1 + gl;
  // Cofactors shared by every right-hand side (Cramer's rule, hand-unrolled; m31 = 0).
  const c11 = m22 * m33 - m23 * m32;
  const c12 = -(m21 * m33);
  const c13 = m21 * m32;
  const c21 = -(m12 * m33 - m13 * m32);
  const c23 = -(m11 * m32);
  const c31 = m12 * m23 - m13 * m22;
  const c33 = m11 * m22 - m12 * m21;
  const det = m11 * c11 + m12 * c12 + m13 * c13;
  // Drive 1: vs = 1, vg2 = 0.
  const r3 = ideal ? 1 : gs;
  let vk = (c31 * r3) / det;
  let vg1 = (c33 * r3) / det;
  out.a11 = -rle1 * (b1 * vg1 - a1 * vk);
  out.a12 = rle2 * a2 * vk;
  // Drive 2: vs = 0, vg2 = 1 (grid 2 also pulls J through RG2, or grid 1 through the leak).
  const q3 = ideal ? 0 : gl;
  vk = (c11 * b2 + c21 * g2 + c31 * q3) / det;
  vg1 = (c13 * b2 + c23 * g2 + c33 * q3) / det;
  out.a21 = -rle1 * (b1 * vg1 - a1 * vk);
  out.a22 = -rle2 * (b2 - a2 * vk);
  // Zout1: load 1 removed, 1 A into plate 1, sources zeroed: only row K's a1, b1 and RHS change,
  // and the cofactors of row K's entries do not involve row K.
  const q1 = c.rp1 + c.rl1;
  const a1o = (c.mu1 + 1) / q1;
  const b1o = c.mu1 / q1;
  const det1 = (a1o + a2 + gk) * c11 + m12 * c12 - b1o * c13;
  vk = (c11 * (c.rl1 / q1)) / det1;
  vg1 = (c13 * (c.rl1 / q1)) / det1;
  out.zout1 = c.rl1 * (1 - (b1o * vg1 - a1o * vk + c.rl1 / q1));
  // Zout2: load 2 removed, 1 A into plate 2.
  const q2 = c.rp2 + c.rl2;
  const a2o = (c.mu2 + 1) / q2;
  const det2 = (a1 + a2o + gk) * c11 + m12 * c12 + m13 * c13;
  vk = (c11 * (c.rl2 / q2)) / det2;
  out.zout2 = c.rl2 * (1 - (c.rl2 / q2 - a2o * vk));
  // Zin: grid 1 driven directly by 1 V, grid 2 at 0; a 2×2 system in (Vk, VJ).
  const vj = (m11 * g1 - m21 * b1) / (m11 * m22 - m12 * m21);
  const iin = g1 * (1 - vj) + gl;
  out.zin = iin > 0 ? 1 / iin : Number.POSITIVE_INFINITY;
  return out;
}

function par(a: number, b: number): number {
  return b === Number.POSITIVE_INFINITY ? a : (a * b) / (a + b);
}
