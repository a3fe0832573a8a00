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
 * Solves [[m11 m12 m13][m21 m22 m23][m31 m32 m33]]·x = r by Cramer's rule; returns component `k`.
 * Hand-unrolled so the per-sample path allocates nothing.
 */
function cramer3(
  m11: number,
  m12: number,
  m13: number,
  m21: number,
  m22: number,
  m23: number,
  m31: number,
  m32: number,
  m33: number,
  r1: number,
  r2: number,
  r3: number,
  k: 0 | 1 | 2,
): number {
  const c11 = m22 * m33 - m23 * m32;
  const c12 = m23 * m31 - m21 * m33;
  const c13 = m21 * m32 - m22 * m31;
  const det = m11 * c11 + m12 * c12 + m13 * c13;
  if (k === 0) return (r1 * c11 + m12 * (r3 * m23 - r2 * m33) + m13 * (r2 * m32 - r3 * m22)) / det;
  if (k === 1) return (m11 * (r2 * m33 - m23 * r3) + r1 * c12 + m13 * (m21 * r3 - r2 * m31)) / det;
  return (m11 * (m22 * r3 - r2 * m32) + m12 * (r2 * m31 - m21 * r3) + r1 * c13) / det;
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
  const gjj = gk + gt + g1 + g2;
  // Row 3 is the grid-1 node, or vg1 = vs when the source is ideal.
  const m31 = 0;
  const m32 = ideal ? 0 : -g1;
  const m33 = ideal ? 1 : gs + g1 + gl;
  // Drive 1: vs = 1, vg2 = 0.
  let vk = cramer3(a1 + a2 + gk, -gk, -b1, -gk, gjj, -g1, m31, m32, m33, 0, 0, ideal ? 1 : gs, 0);
  let vg1 = cramer3(a1 + a2 + gk, -gk, -b1, -gk, gjj, -g1, m31, m32, m33, 0, 0, ideal ? 1 : gs, 2);
  out.a11 = -rle1 * (b1 * vg1 - a1 * vk);
  out.a12 = -rle2 * (-a2 * vk);
  // Drive 2: vs = 0, vg2 = 1 (grid 2 also pulls J through RG2, or grid 1 through the leak).
  vk = cramer3(a1 + a2 + gk, -gk, -b1, -gk, gjj, -g1, m31, m32, m33, b2, g2, ideal ? 0 : gl, 0);
  vg1 = cramer3(a1 + a2 + gk, -gk, -b1, -gk, gjj, -g1, m31, m32, m33, b2, g2, ideal ? 0 : gl, 2);
  out.a21 = -rle1 * (b1 * vg1 - a1 * vk);
  out.a22 = -rle2 * (b2 - a2 * vk);
  // Zout1: load 1 removed, 1 A into plate 1, sources zeroed.
  const q1 = c.rp1 + c.rl1;
  const a1o = (c.mu1 + 1) / q1;
  const b1o = c.mu1 / q1;
  vk = cramer3(a1o + a2 + gk, -gk, -b1o, -gk, gjj, -g1, m31, m32, m33, c.rl1 / q1, 0, 0, 0);
  vg1 = cramer3(a1o + a2 + gk, -gk, -b1o, -gk, gjj, -g1, m31, m32, m33, c.rl1 / q1, 0, 0, 2);
  out.zout1 = c.rl1 * (1 - (b1o * vg1 - a1o * vk + c.rl1 / q1));
  // Zout2: load 2 removed, 1 A into plate 2.
  const q2 = c.rp2 + c.rl2;
  const a2o = (c.mu2 + 1) / q2;
  vk = cramer3(a1 + a2o + gk, -gk, -b1, -gk, gjj, -g1, m31, m32, m33, c.rl2 / q2, 0, 0, 0);
  out.zout2 = c.rl2 * (1 - (c.rl2 / q2 - a2o * vk));
  // Zin: grid 1 driven directly by 1 V, grid 2 at 0.
  const vj = cramer3(a1 + a2 + gk, -gk, -b1, -gk, gjj, -g1, 0, 0, 1, 0, 0, 1, 1);
  const iin = g1 * (1 - vj) + gl;
  out.zin = iin > 0 ? 1 / iin : Number.POSITIVE_INFINITY;
  return out;
}

function par(a: number, b: number): number {
  return b === Number.POSITIVE_INFINITY ? a : (a * b) / (a + b);
}
