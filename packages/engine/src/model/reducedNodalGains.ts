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

/** Slots of the small-signal scratch array read by {@link reducedNodalGainsArr} and closedFormGainsArr. */
export const SS_MU1 = 0;
export const SS_MU2 = 1;
export const SS_RP1 = 2;
export const SS_RP2 = 3;
export const SS_RL1 = 4;
export const SS_RL2 = 5;
export const SS_RK = 6;
export const SS_RT = 7;
export const SS_RG1 = 8;
export const SS_RG2 = 9;
export const SS_RLOAD1 = 10;
export const SS_RLOAD2 = 11;
export const SS_RSOURCE = 12;
/** Length of the small-signal scratch array. */
export const SS_SLOTS = 13;
/** Slots of the gains array written by the array solvers (same order as StageGains). */
export const G_A11 = 0;
export const G_A12 = 1;
export const G_A21 = 2;
export const G_A22 = 3;
export const G_ZOUT1 = 4;
export const G_ZOUT2 = 5;
export const G_ZIN = 6;
/** Length of the gains array. */
export const G_SLOTS = 7;

const scratchIn = new Float64Array(SS_SLOTS);
const scratchOut = new Float64Array(G_SLOTS);

/**
 * Exact midband gains by the node equations reduced by hand to three unknowns (Vk, VJ, Vg1).
 * Grids draw no current, so each plate current is i = (mu·vg − (mu+1)·vk)/(rp + RL∥Rload) and the
 * plate nodes drop out. Handles RG1, RG2, Rload1/2, source resistance and unequal sections;
 * grid 2 is driven from an ideal source (bypassed for AC when used as the second input).
 * Zout_i: inputs zeroed, load i removed, unit current into plate i. Zin: grid 1 driven directly.
 * Writes into `out`, allocates nothing (see {@link reducedNodalGainsArr}, which it calls).
 *
 * @example
 * reducedNodalGainsInto(circuit, createStageGains()).a12;
 */
export function reducedNodalGainsInto(c: SmallSignalCircuit, out: StageGains): StageGains {
  const v = scratchIn;
  v[SS_MU1] = c.mu1;
  v[SS_MU2] = c.mu2;
  v[SS_RP1] = c.rp1;
  v[SS_RP2] = c.rp2;
  v[SS_RL1] = c.rl1;
  v[SS_RL2] = c.rl2;
  v[SS_RK] = c.rk;
  v[SS_RT] = c.rt;
  v[SS_RG1] = c.rg1;
  v[SS_RG2] = c.rg2;
  v[SS_RLOAD1] = c.rload1;
  v[SS_RLOAD2] = c.rload2;
  v[SS_RSOURCE] = c.rsource;
  const g = scratchOut;
  reducedNodalGainsArr(c.capCoupled, c.leakToGrid1, v, g);
  out.a11 = g[G_A11];
  out.a12 = g[G_A12];
  out.a21 = g[G_A21];
  out.a22 = g[G_A22];
  out.zout1 = g[G_ZOUT1];
  out.zout2 = g[G_ZOUT2];
  out.zin = g[G_ZIN];
  return out;
}

/**
 * {@link reducedNodalGainsInto} on typed arrays, for the per-sample path: the circuit in `v`
 * (SS_* slots, Ω), gains into `out` (G_* slots). Numbers travel through Float64Array slots rather
 * than object fields or arguments, so nothing is boxed per sample even when not inlined.
 *
 * @example
 * reducedNodalGainsArr(true, false, v, g); // g[G_A12]
 */
export function reducedNodalGainsArr(
  capCoupled: boolean,
  leakToGrid1: boolean,
  v: Float64Array,
  out: Float64Array,
): void {
  const mu1 = v[SS_MU1];
  const mu2 = v[SS_MU2];
  const rp1 = v[SS_RP1];
  const rp2 = v[SS_RP2];
  const rl1 = v[SS_RL1];
  const rl2 = v[SS_RL2];
  const rload1 = v[SS_RLOAD1];
  const rload2 = v[SS_RLOAD2];
  const rsource = v[SS_RSOURCE];
  const rle1 = rload1 === Number.POSITIVE_INFINITY ? rl1 : (rl1 * rload1) / (rl1 + rload1);
  const rle2 = rload2 === Number.POSITIVE_INFINITY ? rl2 : (rl2 * rload2) / (rl2 + rload2);
  const gk = 1 / v[SS_RK];
  const gt = 1 / v[SS_RT];
  const g1 = capCoupled ? 1 / v[SS_RG1] : 0;
  const g2 = capCoupled ? 1 / v[SS_RG2] : 0;
  const gl = !capCoupled && leakToGrid1 ? 1 / v[SS_RG2] : 0;
  const ideal = !(rsource > 0);
  const gs = ideal ? 0 : 1 / rsource;
  const a1 = (mu1 + 1) / (rp1 + rle1);
  const b1 = mu1 / (rp1 + rle1);
  const a2 = (mu2 + 1) / (rp2 + rle2);
  const b2 = mu2 / (rp2 + rle2);
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
  out[G_A11] = -rle1 * (b1 * vg1 - a1 * vk);
  out[G_A12] = rle2 * a2 * vk;
  // Drive 2: vs = 0, vg2 = 1 (grid 2 also pulls J through RG2, or grid 1 through the leak).
  const q3 = ideal ? 0 : gl;
  vk = (c11 * b2 + c21 * g2 + c31 * q3) / det;
  vg1 = (c13 * b2 + c23 * g2 + c33 * q3) / det;
  out[G_A21] = -rle1 * (b1 * vg1 - a1 * vk);
  out[G_A22] = -rle2 * (b2 - a2 * vk);
  // Zout1: load 1 removed, 1 A into plate 1, sources zeroed: only row K's a1, b1 and RHS change,
  // and the cofactors of row K's entries do not involve row K.
  const q1 = rp1 + rl1;
  const a1o = (mu1 + 1) / q1;
  const b1o = mu1 / q1;
  const det1 = (a1o + a2 + gk) * c11 + m12 * c12 - b1o * c13;
  vk = (c11 * (rl1 / q1)) / det1;
  vg1 = (c13 * (rl1 / q1)) / det1;
  out[G_ZOUT1] = rl1 * (1 - (b1o * vg1 - a1o * vk + rl1 / q1));
  // Zout2: load 2 removed, 1 A into plate 2.
  const q2 = rp2 + rl2;
  const a2o = (mu2 + 1) / q2;
  const det2 = (a1 + a2o + gk) * c11 + m12 * c12 + m13 * c13;
  vk = (c11 * (rl2 / q2)) / det2;
  out[G_ZOUT2] = rl2 * (1 - (rl2 / q2 - a2o * vk));
  // Zin: grid 1 driven directly by 1 V, grid 2 at 0; a 2×2 system in (Vk, VJ).
  const vj = (m11 * g1 - m21 * b1) / (m11 * m22 - m12 * m21);
  const iin = g1 * (1 - vj) + gl;
  out[G_ZIN] = iin > 0 ? 1 / iin : Number.POSITIVE_INFINITY;
}
