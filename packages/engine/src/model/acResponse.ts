import { solveComplexInPlace } from './complexSolve.js';
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
/** Length of the scratch array {@link acResponseArr} needs. */
export const AC_WORK_SLOTS = 2 * 36 + 2 * 6;

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

// Unknown order: the well-conditioned resistive and grid rows first, the plates (whose rows carry
// the gm entries) last; partial pivoting covers the rest.
const J = 0;
const G2 = 1;
const G1 = 2;
const K = 3;
const P1 = 4;
const P2 = 5;
const N = 6;
const B0 = 2 * N * N;

/** Adds admittance (gr + j·gi) between nodes p and q (q < 0: ground) into the interleaved matrix. */
function stamp(w: Float64Array, p: number, q: number, gr: number, gi: number): void {
  const pp = 2 * (p * N + p);
  w[pp] += gr;
  w[pp + 1] += gi;
  if (q < 0) return;
  const qq = 2 * (q * N + q);
  const pq = 2 * (p * N + q);
  const qp = 2 * (q * N + p);
  w[qq] += gr;
  w[qq + 1] += gi;
  w[pq] -= gr;
  w[pq + 1] -= gi;
  w[qp] -= gr;
  w[qp + 1] -= gi;
}

/** Real part of 1/(R + 1/(jωC)) = jωC/(1 + jωCR); C = Infinity gives 1/R, R = Infinity gives 0. */
function seriesRcRe(r: number, c: number, w: number): number {
  if (r === Number.POSITIVE_INFINITY) return 0;
  if (c === Number.POSITIVE_INFINITY) return 1 / r;
  const x = w * c * r;
  return (x * w * c) / (1 + x * x);
}

/** Imaginary part of jωC/(1 + jωCR). */
function seriesRcIm(r: number, c: number, w: number): number {
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
 * Allocation-free: circuit in `v` (SS_*, AC_* slots; Ω, F), scratch `w` (AC_WORK_SLOTS),
 * response into `out` (H_* slots). Returns false if the system is singular.
 *
 * @example
 * acResponseArr(true, false, v, 20e3, w, h); // h[H2_RE], h[H2_IM]
 */
export function acResponseArr(
  capCoupled: boolean,
  leakToGrid1: boolean,
  v: Float64Array,
  f: number,
  w: Float64Array,
  out: Float64Array,
): boolean {
  const om = 2 * Math.PI * f;
  w.fill(0);
  const rp1 = v[SS_RP1];
  const rp2 = v[SS_RP2];
  const gm1 = v[SS_MU1] / rp1;
  const gm2 = v[SS_MU2] / rp2;
  const rload1 = v[SS_RLOAD1];
  const rload2 = v[SS_RLOAD2];
  const cout1 = v[AC_COUT1];
  const cout2 = v[AC_COUT2];
  // Plates: RL, load behind its coupling capacitor, stray capacitance.
  stamp(
    w,
    P1,
    -1,
    1 / v[SS_RL1] + seriesRcRe(rload1, cout1, om),
    seriesRcIm(rload1, cout1, om) + om * v[AC_CSTRAY1],
  );
  stamp(
    w,
    P2,
    -1,
    1 / v[SS_RL2] + seriesRcRe(rload2, cout2, om),
    seriesRcIm(rload2, cout2, om) + om * v[AC_CSTRAY2],
  );
  // Sections: rp from plate to cathode, gm·(vg − vk) from plate to cathode, interelectrode capacitances.
  stamp(w, P1, K, 1 / rp1, om * v[AC_CPK1]);
  stamp(w, P2, K, 1 / rp2, om * v[AC_CPK2]);
  w[2 * (P1 * N + G1)] += gm1;
  w[2 * (P1 * N + K)] -= gm1;
  w[2 * (K * N + G1)] -= gm1;
  w[2 * (K * N + K)] += gm1;
  w[2 * (P2 * N + G2)] += gm2;
  w[2 * (P2 * N + K)] -= gm2;
  w[2 * (K * N + G2)] -= gm2;
  w[2 * (K * N + K)] += gm2;
  stamp(w, G1, K, 0, om * v[AC_CGK1]);
  stamp(w, G2, K, 0, om * v[AC_CGK2]);
  stamp(w, G1, P1, 0, om * v[AC_CGP1]);
  stamp(w, G2, P2, 0, om * v[AC_CGP2]);
  // Cathode resistor and tail.
  stamp(w, K, J, 1 / v[SS_RK], 0);
  stamp(w, J, -1, 1 / v[SS_RT], 0);
  // Grid leaks.
  if (capCoupled) {
    stamp(w, G1, J, 1 / v[SS_RG1], 0);
    stamp(w, G2, J, 1 / v[SS_RG2], 0);
  } else if (leakToGrid1) stamp(w, G1, G2, 1 / v[SS_RG2], 0);
  // Grid 2 to ground through its bypass, or held at AC ground.
  const cg2 = v[AC_CG2];
  const g2Held = cg2 === Number.POSITIVE_INFINITY || (!capCoupled && !leakToGrid1);
  if (g2Held) holdRow(w, G2, 0);
  else stamp(w, G2, -1, 0, om * cg2);
  // Source: 1 V behind rsource and cin (Norton form), or grid 1 driven directly.
  const rs = v[SS_RSOURCE];
  const cin = v[AC_CIN];
  if (cin === Number.POSITIVE_INFINITY && !(rs > 0)) holdRow(w, G1, 1);
  else {
    const r = rs > 0 ? rs : 0;
    const yr = cin === Number.POSITIVE_INFINITY ? 1 / r : seriesRcRe(r, cin, om);
    const yi = cin === Number.POSITIVE_INFINITY ? 0 : seriesRcIm(r, cin, om);
    stamp(w, G1, -1, yr, yi);
    w[B0 + 2 * G1] += yr;
    w[B0 + 2 * G1 + 1] += yi;
  }
  const a = w.subarray(0, B0);
  const b = w.subarray(B0, B0 + 2 * N);
  if (!solveComplexInPlace(a, b, N)) return false;
  divideLoad(b[2 * P1], b[2 * P1 + 1], rload1, cout1, om, out, H1_RE);
  divideLoad(b[2 * P2], b[2 * P2 + 1], rload2, cout2, om, out, H2_RE);
  return true;
}

/** Row p becomes v_p = value (a node held by an ideal source). */
function holdRow(w: Float64Array, p: number, value: number): void {
  for (let j = 0; j < 2 * N; j++) w[2 * p * N + j] = 0;
  w[2 * (p * N + p)] = 1;
  w[B0 + 2 * p] = value;
  w[B0 + 2 * p + 1] = 0;
}

/** out[at], out[at+1] = plate voltage × jωCR/(1 + jωCR): the share across the load behind its capacitor. */
function divideLoad(
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
const scratchW = new Float64Array(AC_WORK_SLOTS);

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
  const ok = acResponseArr(c.capCoupled, c.leakToGrid1, v, f, scratchW, h);
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
