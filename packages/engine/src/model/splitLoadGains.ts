import {
  G_A11,
  G_A12,
  G_A21,
  G_A22,
  G_ZIN,
  G_ZOUT1,
  G_ZOUT2,
  SS_MU1,
  SS_RG1,
  SS_RK,
  SS_RL1,
  SS_RLOAD1,
  SS_RLOAD2,
  SS_RP1,
  SS_RSOURCE,
  SS_RT,
} from './reducedNodalGains.js';

/** Parallel resistance; an Infinity (absent) branch drops out. */
function par(a: number, b: number): number {
  return 1 / (1 / a + 1 / b);
}

/**
 * Exact midband small signal of the split-load (cathodyne) splitter, in closed form. Circuit: one
 * section (mu, rp), plate load RL = rl1 (B+ is AC ground) with the next stage Rload1 on the plate,
 * bias resistor Rb = rk from the cathode to J, cathode load Rt = rt from J to ground, grid leak
 * RG = rg1 from the grid to J, next stage Rload2 on the cathode, source resistance Rs into the
 * grid. Output 1 is the plate, output 2 the cathode.
 *
 * With the grid at vg, the cathode network seen from K (Rb, then Rt to ground and RG to vg, and
 * Rload2) is a Thevenin source vth·vg behind Rke, where
 *   a = Rt/(Rt + RG),  Rkn = Rb + Rt∥RG,  Rke = Rkn∥Rload2,  vth = a·Rke/Rkn,
 * and with RLe = RL∥Rload1 the plate current per volt at the grid is
 *   i = (mu − (mu+1)·vth)/(rp + RLe + (mu+1)·Rke),
 * so A_plate = −RLe·i and A_cathode = vth + Rke·i. With RG → ∞ these are the textbook
 *   A_p = −mu·RL/(rp + RL + (mu+1)·RK),  A_k = mu·RK/(rp + RL + (mu+1)·RK)  (RK = Rb + Rt)
 * (common practice, no source; note the cathode gain's numerator is mu·RK, the cathode-follower
 * result, which is why equal loads give |A| = mu·R/(rp + (mu+2)·R) on both outputs).
 * Zin = RG/(1 − vJ/vg) (the grid leak bootstrapped by the J voltage); the gains from the source
 * are the grid gains times Zin/(Zin + Rs).
 * Output impedances with the grid held at AC ground (ideal drive; Rs is not included):
 *   Zout1 = RL ∥ (rp + (mu+1)·Rke)        (plate; Rload1 removed, Rload2 in place)
 *   Zout2 = Rkn ∥ (rp + RLe)/(mu+1)       (cathode; Rload2 removed, Rload1 in place)
 * (common practice, no source). A21 and A22 have no meaning (one input) and are NaN.
 * Reads the SS_* slots of `v` (section 1's mu and rp; rl2, rg2 and section 2 unused) and writes
 * the G_* slots of `g`.
 *
 * @example
 * splitLoadGainsArr(v, g); // g[G_A11] ≈ −0.88, g[G_A12] ≈ 0.88: mu 18, rp 9k, RL = Rb + Rt = 23k
 */
export function splitLoadGainsArr(v: Float64Array, g: Float64Array): void {
  const mu = v[SS_MU1];
  const rp = v[SS_RP1];
  const rl = v[SS_RL1];
  const rb = v[SS_RK];
  const rt = v[SS_RT];
  const rg = v[SS_RG1];
  const rle = par(rl, v[SS_RLOAD1]);
  const a = rt / (rt + rg);
  const rkn = rb + par(rt, rg);
  const rke = par(rkn, v[SS_RLOAD2]);
  const vth = (a * rke) / rkn;
  const i = (mu - (mu + 1) * vth) / (rp + rle + (mu + 1) * rke);
  const ap = -rle * i;
  const ak = vth + rke * i;
  // J from its node equation with K at ak and the grid at 1 (Rb = 0 puts J on K).
  const vj = rb > 0 ? (ak / rb + 1 / rg) / (1 / rb + 1 / rg + 1 / rt) : ak;
  const zin = rg / (1 - vj);
  const src = zin / (zin + v[SS_RSOURCE]);
  g[G_A11] = ap * src;
  g[G_A12] = ak * src;
  g[G_A21] = Number.NaN;
  g[G_A22] = Number.NaN;
  g[G_ZIN] = zin;
  g[G_ZOUT1] = par(rl, rp + (mu + 1) * rke);
  g[G_ZOUT2] = par(rkn, (rp + rle) / (mu + 1));
}
