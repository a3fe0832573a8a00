import {
  SS_MU1,
  SS_MU2,
  SS_RG1,
  SS_RG2,
  SS_RK,
  SS_RL1,
  SS_RL2,
  SS_RLOAD1,
  SS_RLOAD2,
  SS_RP1,
  SS_RP2,
  SS_RSOURCE,
  SS_RT,
  SS_SLOTS,
  type SmallSignalCircuit,
} from './reducedNodalGains.js';

/** Capacitor slots after the small-signal (SS_*) slots of the circuit array (farads). */
export const AC_CIN = SS_SLOTS;
export const AC_CG2 = SS_SLOTS + 1;
export const AC_COUT1 = SS_SLOTS + 2;
export const AC_COUT2 = SS_SLOTS + 3;
export const AC_CSTRAY1 = SS_SLOTS + 4;
export const AC_CSTRAY2 = SS_SLOTS + 5;
export const AC_CGK1 = SS_SLOTS + 6;
export const AC_CGK2 = SS_SLOTS + 7;
export const AC_CGP1 = SS_SLOTS + 8;
export const AC_CGP2 = SS_SLOTS + 9;
export const AC_CPK1 = SS_SLOTS + 10;
export const AC_CPK2 = SS_SLOTS + 11;
/** Length of the circuit array {@link acResponseArr} reads (SS_* slots, then AC_* slots). */
export const AC_SLOTS = SS_SLOTS + 12;
/** Slots of the response array: output 1 and output 2 per volt at the source, (re, im). */
export const H1_RE = 0;
export const H1_IM = 1;
export const H2_RE = 2;
export const H2_IM = 3;
/** Length of the response array. */
export const H_SLOTS = 4;

/**
 * The small-signal circuit with its capacitances (F). Coupling and bypass capacitors: Infinity =
 * ideal (a short for AC). Stray and tube capacitances: 0 = absent.
 */
export interface AcCircuit extends SmallSignalCircuit {
  /** Input coupling capacitor, in series with rsource between the source and grid 1. */
  cin: number;
  /** Grid 2 to ground (its AC bypass). */
  cg2: number;
  /** Plate i to its load rload_i (the next stage's grid resistor). */
  cout1: number;
  cout2: number;
  /** Plate i to ground: wiring plus next-stage input capacitance. */
  cstray1: number;
  cstray2: number;
  /** Tube interelectrode capacitances per section: grid–cathode, grid–plate, plate–cathode. */
  cgk1: number;
  cgk2: number;
  cgp1: number;
  cgp2: number;
  cpk1: number;
  cpk2: number;
}

/**
 * A frequency-response solver over the circuit array: `v` (SS_*, AC_* slots), f in Hz, the
 * response into `out` (H_* slots); false when the solve fails. The corner search takes one, so
 * every topology shares it.
 */
export type AcSolver = (v: Float64Array, f: number, out: Float64Array) => boolean;

/**
 * The long-tailed pair's {@link AcSolver} for one form of the stage (see acResponseArr).
 *
 * @example
 * cornerFrequencyArr(pairAcSolver(true, false), v, 1, gain, 'high', 1e3, 0, h);
 */
export function pairAcSolver(capCoupled: boolean, leakToGrid1: boolean): AcSolver {
  return (v, f, out) => acResponseArr(capCoupled, leakToGrid1, v, f, out);
}

/**
 * Real part of 1/(R + 1/(jωC)) = jωC/(1 + jωCR); C = Infinity gives 1/R, R = Infinity gives 0.
 *
 * @example
 * seriesRcRe(1e3, Infinity, 1); // 1e-3 (S)
 */
export function seriesRcRe(r: number, c: number, w: number): number {
  if (r === Number.POSITIVE_INFINITY) return 0;
  if (c === Number.POSITIVE_INFINITY) return 1 / r;
  const x = w * c * r;
  return (x * w * c) / (1 + x * x);
}

/**
 * Imaginary part of jωC/(1 + jωCR) (S).
 *
 * @example
 * seriesRcIm(1e3, 1e-6, 1e3); // ≈ 0.5e-3 (S)
 */
export function seriesRcIm(r: number, c: number, w: number): number {
  if (r === Number.POSITIVE_INFINITY || c === Number.POSITIVE_INFINITY) return 0;
  const x = w * c * r;
  return (w * c) / (1 + x * x);
}

/**
 * Frequency response of the pair at f hertz, grid 1 driven by 1 V behind rsource and the input
 * capacitor, grid 2 held by its bypass capacitor (an ideal AC ground when cg2 is Infinity, and
 * always in direct-coupled 'fixed' mode). Complex nodal solve of plates, cathode, tail junction and
 * both grids with the tubes as mu·vgk sources behind rp and their interelectrode capacitances (so
 * the Miller effect at each grid comes out of the solve). Output i is the voltage across rload_i
 * behind cout_i (the next stage's grid), or the plate voltage when there is no load.
 * Allocation-free: circuit in `v` (SS_*, AC_* slots; Ω, F), response into `out` (H_* slots).
 * Returns false if the solve gives a non-finite result (a singular circuit).
 *
 * @example
 * acResponseArr(true, false, v, 20e3, h); // h[H2_RE], h[H2_IM]
 */
export function acResponseArr(
  capCoupled: boolean,
  leakToGrid1: boolean,
  v: Float64Array,
  f: number,
  out: Float64Array,
): boolean {
  const om = 2 * Math.PI * f;
  const rp1 = v[SS_RP1];
  const rp2 = v[SS_RP2];
  const ga1 = 1 / rp1;
  const ga2 = 1 / rp2;
  const gm1 = v[SS_MU1] * ga1;
  const gm2 = v[SS_MU2] * ga2;
  const rload1 = v[SS_RLOAD1];
  const rload2 = v[SS_RLOAD2];
  const cout1 = v[AC_COUT1];
  const cout2 = v[AC_COUT2];
  const wgk1 = om * v[AC_CGK1];
  const wgk2 = om * v[AC_CGK2];
  const wgp1 = om * v[AC_CGP1];
  const wgp2 = om * v[AC_CGP2];
  const wpk1 = om * v[AC_CPK1];
  const wpk2 = om * v[AC_CPK2];
  const gk = 1 / v[SS_RK];
  const gt = 1 / v[SS_RT];
  const g1 = capCoupled ? 1 / v[SS_RG1] : 0;
  const g2 = capCoupled ? 1 / v[SS_RG2] : 0;
  const gl = !capCoupled && leakToGrid1 ? 1 / v[SS_RG2] : 0;
  // Source admittance 1/(rsource + 1/(jω·cin)) in Norton form, unless grid 1 is driven directly.
  const rs = v[SS_RSOURCE];
  const cin = v[AC_CIN];
  const g1Held = cin === Number.POSITIVE_INFINITY && !(rs > 0);
  const ysr = g1Held ? 0 : cin === Number.POSITIVE_INFINITY ? 1 / rs : seriesRcRe(rs > 0 ? rs : 0, cin, om);
  const ysi = g1Held ? 0 : seriesRcIm(rs > 0 ? rs : 0, cin, om);
  const cg2 = v[AC_CG2];
  const g2Held = cg2 === Number.POSITIVE_INFINITY || (!capCoupled && !leakToGrid1);
  const wg2 = g2Held ? 0 : om * cg2;
  // Node equations (currents leaving each node), entries r_ROW_COL + j·i_ROW_COL, unknowns in the
  // elimination order P1 P2 K G1 G2 J: eliminating the plates first keeps every multiplier below
  // one in size, so no pivoting is needed. Each section: rp from plate to cathode and
  // gm·(vg − vk) from plate to cathode, with Cgk, Cgp and Cpk.
  const r_P1_P1 = 1 / v[SS_RL1] + seriesRcRe(rload1, cout1, om) + ga1;
  const i_P1_P1 = seriesRcIm(rload1, cout1, om) + om * v[AC_CSTRAY1] + wpk1 + wgp1;
  const r_P1_K = -ga1 - gm1;
  const i_P1_K = -wpk1;
  const r_P1_G1 = gm1;
  const i_P1_G1 = -wgp1;
  const r_P2_P2 = 1 / v[SS_RL2] + seriesRcRe(rload2, cout2, om) + ga2;
  const i_P2_P2 = seriesRcIm(rload2, cout2, om) + om * v[AC_CSTRAY2] + wpk2 + wgp2;
  const r_P2_K = -ga2 - gm2;
  const i_P2_K = -wpk2;
  const r_P2_G2 = gm2;
  const i_P2_G2 = -wgp2;
  const r_K_P1 = -ga1;
  const i_K_P1 = -wpk1;
  const r_K_P2 = -ga2;
  const i_K_P2 = -wpk2;
  let r_K_K = gk + ga1 + ga2 + gm1 + gm2;
  let i_K_K = wpk1 + wpk2 + wgk1 + wgk2;
  let r_K_G1 = -gm1;
  let i_K_G1 = -wgk1;
  let r_K_G2 = -gm2;
  let i_K_G2 = -wgk2;
  const r_K_J = -gk;
  // Grid 1: leak, tube capacitances, source; or held at 1 V.
  const r_G1_P1 = 0;
  const i_G1_P1 = g1Held ? 0 : -wgp1;
  let r_G1_K = 0;
  let i_G1_K = g1Held ? 0 : -wgk1;
  let r_G1_G1 = g1Held ? 1 : g1 + gl + ysr;
  let i_G1_G1 = g1Held ? 0 : wgk1 + wgp1 + ysi;
  let r_G1_G2 = g1Held ? 0 : -gl;
  let r_G1_J = g1Held ? 0 : -g1;
  const br3 = g1Held ? 1 : ysr;
  const bi3 = g1Held ? 0 : ysi;
  // Grid 2: leak, bypass, tube capacitances; or held at AC ground.
  const r_G2_P2 = 0;
  const i_G2_P2 = g2Held ? 0 : -wgp2;
  let r_G2_K = 0;
  let i_G2_K = g2Held ? 0 : -wgk2;
  let r_G2_G1 = g2Held ? 0 : -gl;
  let r_G2_G2 = g2Held ? 1 : g2 + gl;
  let i_G2_G2 = g2Held ? 0 : wg2 + wgk2 + wgp2;
  let r_G2_J = g2Held ? 0 : -g2;
  // Tail junction: Rk, Rt and the grid leaks (all real).
  const r_J_K = -gk;
  let r_J_G1 = -g1;
  let r_J_G2 = -g2;
  let r_J_J = gk + gt + g1 + g2;
  // Imaginary parts of the real entries, for the fill-in the elimination brings.
  let i_G1_G2 = 0;
  let i_G1_J = 0;
  let i_G2_G1 = 0;
  let i_G2_J = 0;
  let i_J_G1 = 0;
  let i_J_G2 = 0;
  let i_J_J = 0;
  // Unrolled Gaussian elimination without pivoting, skipping structural zeros and the imaginary
  // parts of entries that stay real (written out mechanically from the pattern above).
  const d0 = r_P1_P1 * r_P1_P1 + i_P1_P1 * i_P1_P1;
  const q0 = 1 / d0;
  const ir0 = r_P1_P1 * q0;
  const ii0 = -i_P1_P1 * q0;
  const lr20 = r_K_P1 * ir0 - i_K_P1 * ii0;
  const li20 = r_K_P1 * ii0 + i_K_P1 * ir0;
  r_K_K -= lr20 * r_P1_K - li20 * i_P1_K;
  i_K_K -= lr20 * i_P1_K + li20 * r_P1_K;
  r_K_G1 -= lr20 * r_P1_G1 - li20 * i_P1_G1;
  i_K_G1 -= lr20 * i_P1_G1 + li20 * r_P1_G1;
  const lr30 = r_G1_P1 * ir0 - i_G1_P1 * ii0;
  const li30 = r_G1_P1 * ii0 + i_G1_P1 * ir0;
  r_G1_K -= lr30 * r_P1_K - li30 * i_P1_K;
  i_G1_K -= lr30 * i_P1_K + li30 * r_P1_K;
  r_G1_G1 -= lr30 * r_P1_G1 - li30 * i_P1_G1;
  i_G1_G1 -= lr30 * i_P1_G1 + li30 * r_P1_G1;
  const d1 = r_P2_P2 * r_P2_P2 + i_P2_P2 * i_P2_P2;
  const q1 = 1 / d1;
  const ir1 = r_P2_P2 * q1;
  const ii1 = -i_P2_P2 * q1;
  const lr21 = r_K_P2 * ir1 - i_K_P2 * ii1;
  const li21 = r_K_P2 * ii1 + i_K_P2 * ir1;
  r_K_K -= lr21 * r_P2_K - li21 * i_P2_K;
  i_K_K -= lr21 * i_P2_K + li21 * r_P2_K;
  r_K_G2 -= lr21 * r_P2_G2 - li21 * i_P2_G2;
  i_K_G2 -= lr21 * i_P2_G2 + li21 * r_P2_G2;
  const lr41 = r_G2_P2 * ir1 - i_G2_P2 * ii1;
  const li41 = r_G2_P2 * ii1 + i_G2_P2 * ir1;
  r_G2_K -= lr41 * r_P2_K - li41 * i_P2_K;
  i_G2_K -= lr41 * i_P2_K + li41 * r_P2_K;
  r_G2_G2 -= lr41 * r_P2_G2 - li41 * i_P2_G2;
  i_G2_G2 -= lr41 * i_P2_G2 + li41 * r_P2_G2;
  const d2 = r_K_K * r_K_K + i_K_K * i_K_K;
  const q2 = 1 / d2;
  const ir2 = r_K_K * q2;
  const ii2 = -i_K_K * q2;
  const lr32 = r_G1_K * ir2 - i_G1_K * ii2;
  const li32 = r_G1_K * ii2 + i_G1_K * ir2;
  r_G1_G1 -= lr32 * r_K_G1 - li32 * i_K_G1;
  i_G1_G1 -= lr32 * i_K_G1 + li32 * r_K_G1;
  r_G1_G2 -= lr32 * r_K_G2 - li32 * i_K_G2;
  i_G1_G2 -= lr32 * i_K_G2 + li32 * r_K_G2;
  r_G1_J -= lr32 * r_K_J;
  i_G1_J -= li32 * r_K_J;
  const lr42 = r_G2_K * ir2 - i_G2_K * ii2;
  const li42 = r_G2_K * ii2 + i_G2_K * ir2;
  r_G2_G1 -= lr42 * r_K_G1 - li42 * i_K_G1;
  i_G2_G1 -= lr42 * i_K_G1 + li42 * r_K_G1;
  r_G2_G2 -= lr42 * r_K_G2 - li42 * i_K_G2;
  i_G2_G2 -= lr42 * i_K_G2 + li42 * r_K_G2;
  r_G2_J -= lr42 * r_K_J;
  i_G2_J -= li42 * r_K_J;
  const lr52 = r_J_K * ir2;
  const li52 = r_J_K * ii2;
  r_J_G1 -= lr52 * r_K_G1 - li52 * i_K_G1;
  i_J_G1 -= lr52 * i_K_G1 + li52 * r_K_G1;
  r_J_G2 -= lr52 * r_K_G2 - li52 * i_K_G2;
  i_J_G2 -= lr52 * i_K_G2 + li52 * r_K_G2;
  r_J_J -= lr52 * r_K_J;
  i_J_J -= li52 * r_K_J;
  const d3 = r_G1_G1 * r_G1_G1 + i_G1_G1 * i_G1_G1;
  const q3 = 1 / d3;
  const ir3 = r_G1_G1 * q3;
  const ii3 = -i_G1_G1 * q3;
  const lr43 = r_G2_G1 * ir3 - i_G2_G1 * ii3;
  const li43 = r_G2_G1 * ii3 + i_G2_G1 * ir3;
  r_G2_G2 -= lr43 * r_G1_G2 - li43 * i_G1_G2;
  i_G2_G2 -= lr43 * i_G1_G2 + li43 * r_G1_G2;
  r_G2_J -= lr43 * r_G1_J - li43 * i_G1_J;
  i_G2_J -= lr43 * i_G1_J + li43 * r_G1_J;
  let br4 = 0;
  let bi4 = 0;
  br4 -= lr43 * br3 - li43 * bi3;
  bi4 -= lr43 * bi3 + li43 * br3;
  const lr53 = r_J_G1 * ir3 - i_J_G1 * ii3;
  const li53 = r_J_G1 * ii3 + i_J_G1 * ir3;
  r_J_G2 -= lr53 * r_G1_G2 - li53 * i_G1_G2;
  i_J_G2 -= lr53 * i_G1_G2 + li53 * r_G1_G2;
  r_J_J -= lr53 * r_G1_J - li53 * i_G1_J;
  i_J_J -= lr53 * i_G1_J + li53 * r_G1_J;
  let br5 = 0;
  let bi5 = 0;
  br5 -= lr53 * br3 - li53 * bi3;
  bi5 -= lr53 * bi3 + li53 * br3;
  const d4 = r_G2_G2 * r_G2_G2 + i_G2_G2 * i_G2_G2;
  const q4 = 1 / d4;
  const ir4 = r_G2_G2 * q4;
  const ii4 = -i_G2_G2 * q4;
  const lr54 = r_J_G2 * ir4 - i_J_G2 * ii4;
  const li54 = r_J_G2 * ii4 + i_J_G2 * ir4;
  r_J_J -= lr54 * r_G2_J - li54 * i_G2_J;
  i_J_J -= lr54 * i_G2_J + li54 * r_G2_J;
  br5 -= lr54 * br4 - li54 * bi4;
  bi5 -= lr54 * bi4 + li54 * br4;
  const d5 = r_J_J * r_J_J + i_J_J * i_J_J;
  const q5 = 1 / d5;
  const ir5 = r_J_J * q5;
  const ii5 = -i_J_J * q5;
  const sr5 = br5;
  const si5 = bi5;
  const xr5 = sr5 * ir5 - si5 * ii5;
  const xi5 = sr5 * ii5 + si5 * ir5;
  const sr4 = br4 - (r_G2_J * xr5 - i_G2_J * xi5);
  const si4 = bi4 - (r_G2_J * xi5 + i_G2_J * xr5);
  const xr4 = sr4 * ir4 - si4 * ii4;
  const xi4 = sr4 * ii4 + si4 * ir4;
  const sr3 = br3 - (r_G1_G2 * xr4 - i_G1_G2 * xi4) - (r_G1_J * xr5 - i_G1_J * xi5);
  const si3 = bi3 - (r_G1_G2 * xi4 + i_G1_G2 * xr4) - (r_G1_J * xi5 + i_G1_J * xr5);
  const xr3 = sr3 * ir3 - si3 * ii3;
  const xi3 = sr3 * ii3 + si3 * ir3;
  const sr2 = 0 - (r_K_G1 * xr3 - i_K_G1 * xi3) - (r_K_G2 * xr4 - i_K_G2 * xi4) - r_K_J * xr5;
  const si2 = 0 - (r_K_G1 * xi3 + i_K_G1 * xr3) - (r_K_G2 * xi4 + i_K_G2 * xr4) - r_K_J * xi5;
  const xr2 = sr2 * ir2 - si2 * ii2;
  const xi2 = sr2 * ii2 + si2 * ir2;
  const sr1 = 0 - (r_P2_K * xr2 - i_P2_K * xi2) - (r_P2_G2 * xr4 - i_P2_G2 * xi4);
  const si1 = 0 - (r_P2_K * xi2 + i_P2_K * xr2) - (r_P2_G2 * xi4 + i_P2_G2 * xr4);
  const xr1 = sr1 * ir1 - si1 * ii1;
  const xi1 = sr1 * ii1 + si1 * ir1;
  const sr0 = 0 - (r_P1_K * xr2 - i_P1_K * xi2) - (r_P1_G1 * xr3 - i_P1_G1 * xi3);
  const si0 = 0 - (r_P1_K * xi2 + i_P1_K * xr2) - (r_P1_G1 * xi3 + i_P1_G1 * xr3);
  const xr0 = sr0 * ir0 - si0 * ii0;
  const xi0 = sr0 * ii0 + si0 * ir0;
  if (!(Number.isFinite(xr0) && Number.isFinite(xr1) && Number.isFinite(xi0) && Number.isFinite(xi1)))
    return false;
  divideLoad(xr0, xi0, rload1, cout1, om, out, H1_RE);
  divideLoad(xr1, xi1, rload2, cout2, om, out, H2_RE);
  return true;
}

/**
 * out[at], out[at+1] = node voltage × jωCR/(1 + jωCR): the share across the load behind its
 * coupling capacitor (the node voltage itself when there is no load or the capacitor is ideal).
 *
 * @example
 * divideLoad(1, 0, 1e5, 1e-7, 100, h, H1_RE); // h[0] = 0.5, h[1] = 0.5 (ωCR = 1)
 */
export function divideLoad(
  pr: number,
  pi: number,
  r: number,
  c: number,
  om: number,
  out: Float64Array,
  at: number,
): void {
  if (r === Number.POSITIVE_INFINITY || c === Number.POSITIVE_INFINITY) {
    out[at] = pr;
    out[at + 1] = pi;
    return;
  }
  const x = om * c * r;
  const d = 1 + x * x;
  // jx/(1 + jx) = (x² + jx)/(1 + x²)
  const tr = (x * x) / d;
  const ti = x / d;
  out[at] = pr * tr - pi * ti;
  out[at + 1] = pr * ti + pi * tr;
}

const scratchV = new Float64Array(AC_SLOTS);

/**
 * {@link acResponseArr} for a circuit object (allocates the result; for nominal views and tests).
 *
 * @example
 * acResponse(circuit, 1000).h2; // { re, im } of output 2 per volt
 */
export function acResponse(c: AcCircuit, f: number): { ok: boolean; h1: Complex; h2: Complex } {
  const v = scratchV;
  writeAcCircuit(c, v);
  const h = new Float64Array(H_SLOTS);
  const ok = acResponseArr(c.capCoupled, c.leakToGrid1, v, f, h);
  return { ok, h1: { re: h[H1_RE], im: h[H1_IM] }, h2: { re: h[H2_RE], im: h[H2_IM] } };
}

/** A complex number. */
export type Complex = { re: number; im: number };

/**
 * Writes a circuit object into the slots {@link acResponseArr} reads.
 *
 * @example
 * writeAcCircuit(circuit, new Float64Array(AC_SLOTS));
 */
export function writeAcCircuit(c: AcCircuit, v: Float64Array): void {
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
  v[AC_CIN] = c.cin;
  v[AC_CG2] = c.cg2;
  v[AC_COUT1] = c.cout1;
  v[AC_COUT2] = c.cout2;
  v[AC_CSTRAY1] = c.cstray1;
  v[AC_CSTRAY2] = c.cstray2;
  v[AC_CGK1] = c.cgk1;
  v[AC_CGK2] = c.cgk2;
  v[AC_CGP1] = c.cgp1;
  v[AC_CGP2] = c.cgp2;
  v[AC_CPK1] = c.cpk1;
  v[AC_CPK2] = c.cpk2;
}
