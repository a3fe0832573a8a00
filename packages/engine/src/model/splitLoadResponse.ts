import {
  AC_CGK1,
  AC_CGP1,
  AC_CIN,
  AC_COUT1,
  AC_COUT2,
  AC_CPK1,
  AC_CSTRAY1,
  AC_CSTRAY2,
  divideLoad,
  H1_RE,
  H2_RE,
  seriesRcIm,
  seriesRcRe,
} from './acResponse.js';
import { solveComplexInPlace } from './complexSolve.js';
import {
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

// Node order of the 4×4 system: plate, cathode, junction J (between Rb and Rt), grid.
const P = 0;
const K = 1;
const J = 2;
const G = 3;
const N = 4;
// Scratch for the solve (matrix and right-hand side as (re, im) pairs): allocation-free per call.
const A = new Float64Array(2 * N * N);
const B = new Float64Array(2 * N);

function put(row: number, c: number, re: number, im: number): void {
  const t = 2 * (row * N + c);
  A[t] += re;
  A[t + 1] += im;
}

/**
 * Frequency response of the split-load (cathodyne) splitter at f hertz, the grid driven by 1 V
 * behind rsource and the input capacitor cin. Complex nodal solve of plate, cathode, junction J and
 * grid: the section as a mu·vgk source behind rp with its interelectrode capacitances (Cgk from
 * grid to cathode, which the cathode follower bootstraps; Cgp from grid to plate, which sees the
 * plate gain; Cpk), plate load RL = rl1 (B+ is AC ground), bias resistor Rb = rk from the cathode
 * to J, cathode load Rt = rt from J to ground, grid leak RG = rg1 from the grid to J. Output 1 is
 * the voltage across rload1 behind cout1 on the plate, output 2 across rload2 behind cout2 on the
 * cathode (the node itself when there is no load); cstray1 and cstray2 load the plate and cathode.
 * Reads the SS_* slots (section 1, as splitLoadGainsArr) and the AC_* slots cin, cout1, cout2,
 * cstray1, cstray2, cgk1, cgp1, cpk1 (cg2 and section 2 unused); writes the H_* slots of `out`.
 * Solved by Gaussian elimination with partial pivoting (solveComplexInPlace); allocation-free.
 * Returns false if the solve gives a non-finite result (a singular circuit).
 *
 * @example
 * splitLoadResponseArr(v, 20e3, h); // h[H1_RE], h[H1_IM]: plate; h[H2_RE], h[H2_IM]: cathode
 */
export function splitLoadResponseArr(v: Float64Array, f: number, out: Float64Array): boolean {
  const om = 2 * Math.PI * f;
  const ga = 1 / v[SS_RP1];
  const gm = v[SS_MU1] * ga;
  const rb = v[SS_RK];
  const gt = 1 / v[SS_RT];
  const gg = 1 / v[SS_RG1];
  const rload1 = v[SS_RLOAD1];
  const rload2 = v[SS_RLOAD2];
  const cout1 = v[AC_COUT1];
  const cout2 = v[AC_COUT2];
  const wgk = om * v[AC_CGK1];
  const wgp = om * v[AC_CGP1];
  const wpk = om * v[AC_CPK1];
  const rs = v[SS_RSOURCE];
  const cin = v[AC_CIN];
  const held = cin === Number.POSITIVE_INFINITY && !(rs > 0);
  const r0 = rs > 0 ? rs : 0;
  const ysr = held ? 0 : cin === Number.POSITIVE_INFINITY ? 1 / rs : seriesRcRe(r0, cin, om);
  const ysi = held ? 0 : seriesRcIm(r0, cin, om);
  A.fill(0);
  B.fill(0);
  // Currents leaving each node. The section: gm·(vG − vK) + (vP − vK)/rp from plate to cathode.
  put(P, P, 1 / v[SS_RL1] + seriesRcRe(rload1, cout1, om) + ga, seriesRcIm(rload1, cout1, om));
  put(P, P, 0, om * v[AC_CSTRAY1] + wpk + wgp);
  put(P, K, -ga - gm, -wpk);
  put(P, G, gm, -wgp);
  put(K, P, -ga, -wpk);
  put(K, K, ga + gm + seriesRcRe(rload2, cout2, om), seriesRcIm(rload2, cout2, om));
  put(K, K, 0, om * v[AC_CSTRAY2] + wpk + wgk);
  put(K, G, -gm, -wgk);
  if (rb > 0) {
    const gb = 1 / rb;
    put(K, K, gb, 0);
    put(K, J, -gb, 0);
    put(J, K, -gb, 0);
    put(J, J, gb + gt + gg, 0);
    put(J, G, -gg, 0);
  } else {
    // Rb = 0: J is the cathode. Row K collects J's branches (Rt, the grid leak); row J says vJ = vK.
    put(K, K, gt + gg, 0);
    put(K, G, -gg, 0);
    put(J, J, 1, 0);
    put(J, K, -1, 0);
  }
  if (held) {
    put(G, G, 1, 0);
    B[2 * G] = 1;
  } else {
    put(G, P, 0, -wgp);
    put(G, K, 0, -wgk);
    put(G, J, -gg, 0);
    put(G, G, gg + ysr, wgk + wgp + ysi);
    B[2 * G] = ysr;
    B[2 * G + 1] = ysi;
  }
  if (!solveComplexInPlace(A, B, N)) return false;
  const pr = B[2 * P];
  const pi = B[2 * P + 1];
  const kr = B[2 * K];
  const ki = B[2 * K + 1];
  if (!(Number.isFinite(pr) && Number.isFinite(pi) && Number.isFinite(kr) && Number.isFinite(ki)))
    return false;
  divideLoad(pr, pi, rload1, cout1, om, out, H1_RE);
  divideLoad(kr, ki, rload2, cout2, om, out, H2_RE);
  return true;
}
