import * as slots from './reducedNodalGains.js';

// Slot numbers copied once: imported bindings can cost a getter call per use in transpiled modules.
const G_A11 = slots.G_A11;
const G_A12 = slots.G_A12;
const G_A21 = slots.G_A21;
const G_A22 = slots.G_A22;
const G_ZIN = slots.G_ZIN;
const G_ZOUT1 = slots.G_ZOUT1;
const G_ZOUT2 = slots.G_ZOUT2;
const SS_MU1 = slots.SS_MU1;
const SS_MU2 = slots.SS_MU2;
const SS_RK = slots.SS_RK;
const SS_RL1 = slots.SS_RL1;
const SS_RL2 = slots.SS_RL2;
const SS_RP1 = slots.SS_RP1;
const SS_RP2 = slots.SS_RP2;
const SS_RT = slots.SS_RT;

/** Midband gains and output impedances of the pair (dimensionless, Ω). */
export interface StageGains {
  a11: number;
  a12: number;
  a21: number;
  a22: number;
  zout1: number;
  zout2: number;
  /** Input impedance at grid 1 (Ω); Infinity when nothing loads the grid. */
  zin: number;
}

/**
 * Creates a zeroed {@link StageGains} to fill in place.
 *
 * @example
 * const g = createStageGains();
 */
export function createStageGains(): StageGains {
  return { a11: 0, a12: 0, a21: 0, a22: 0, zout1: 0, zout2: 0, zin: 0 };
}

/**
 * Closed-form midband gains of the ideal pair (grid leaks, external loads and source resistance
 * ignored; triode = mu·vgk source behind rp). From the node equations with Ri = RLi + rpi and
 * RK = Rk + Rt (the bias resistor is unbypassed, so the whole Rk + Rt is the cathode's AC path):
 *   D   = 1/RK + (mu1+1)/R1 + (mu2+1)/R2
 *   A11 = −(RL1/R1)·(mu1 − (mu1+1)·(mu1/R1)/D)      A12 = mu1·(mu2+1)·RL2/(R1·R2·D)
 *   A21 = mu2·(mu1+1)·RL1/(R1·R2·D)                 A22 = −(RL2/R2)·(mu2 − (mu2+1)·(mu2/R2)/D)
 *   Zout1 = RL1 ∥ (rp1 + (mu1+1)/(1/RK + (mu2+1)/R2))
 * Writes into `out` (no allocation) and returns it. Ohms in.
 *
 * @example
 * closedFormGainsInto(100, 100, 62.5e3, 62.5e3, 100e3, 100e3, 11e3, createStageGains()).a11; // ≈ −32.9
 */
export function closedFormGainsInto(
  mu1: number,
  mu2: number,
  rp1: number,
  rp2: number,
  rl1: number,
  rl2: number,
  rkTotal: number,
  out: StageGains,
): StageGains {
  const r1 = rl1 + rp1;
  const r2 = rl2 + rp2;
  const gK = 1 / rkTotal;
  const d = gK + (mu1 + 1) / r1 + (mu2 + 1) / r2;
  out.a11 = -(rl1 / r1) * (mu1 - ((mu1 + 1) * (mu1 / r1)) / d);
  out.a12 = (mu1 * (mu2 + 1) * rl2) / (r1 * r2 * d);
  out.a21 = (mu2 * (mu1 + 1) * rl1) / (r1 * r2 * d);
  out.a22 = -(rl2 / r2) * (mu2 - ((mu2 + 1) * (mu2 / r2)) / d);
  const zp1 = rp1 + (mu1 + 1) / (gK + (mu2 + 1) / r2);
  const zp2 = rp2 + (mu2 + 1) / (gK + (mu1 + 1) / r1);
  out.zout1 = (rl1 * zp1) / (rl1 + zp1);
  out.zout2 = (rl2 * zp2) / (rl2 + zp2);
  out.zin = Number.POSITIVE_INFINITY;
  return out;
}

/**
 * {@link closedFormGainsInto} on typed arrays for the per-sample path: mu, rp, RL, Rk, Rt from the
 * SS_* slots of `v` (RK = Rk + Rt), gains into the G_* slots of `out`. Nothing is boxed per sample.
 *
 * @example
 * closedFormGainsArr(v, g); // g[G_A11]
 */
export function closedFormGainsArr(v: Float64Array, out: Float64Array): void {
  const mu1 = v[SS_MU1];
  const mu2 = v[SS_MU2];
  const rp1 = v[SS_RP1];
  const rp2 = v[SS_RP2];
  const rl1 = v[SS_RL1];
  const rl2 = v[SS_RL2];
  const r1 = rl1 + rp1;
  const r2 = rl2 + rp2;
  const gK = 1 / (v[SS_RK] + v[SS_RT]);
  const d = gK + (mu1 + 1) / r1 + (mu2 + 1) / r2;
  out[G_A11] = -(rl1 / r1) * (mu1 - ((mu1 + 1) * (mu1 / r1)) / d);
  out[G_A12] = (mu1 * (mu2 + 1) * rl2) / (r1 * r2 * d);
  out[G_A21] = (mu2 * (mu1 + 1) * rl1) / (r1 * r2 * d);
  out[G_A22] = -(rl2 / r2) * (mu2 - ((mu2 + 1) * (mu2 / r2)) / d);
  const zp1 = rp1 + (mu1 + 1) / (gK + (mu2 + 1) / r2);
  const zp2 = rp2 + (mu2 + 1) / (gK + (mu1 + 1) / r1);
  out[G_ZOUT1] = (rl1 * zp1) / (rl1 + zp1);
  out[G_ZOUT2] = (rl2 * zp2) / (rl2 + zp2);
  out[G_ZIN] = Number.POSITIVE_INFINITY;
}
