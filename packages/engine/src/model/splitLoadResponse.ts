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
 * The elimination is unrolled (order P K J G, every multiplier at most about one in size, so no
 * pivoting; structural zeros skipped) and allocation-free. Returns false if the solve gives a
 * non-finite result (a singular circuit).
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
  // Node equations (currents leaving each node), entries r_ROW_COL + j·i_ROW_COL. The section:
  // gm·(vG − vK) + (vP − vK)/rp from plate to cathode, with Cgk, Cgp and Cpk.
  const r_P_P = 1 / v[SS_RL1] + seriesRcRe(rload1, cout1, om) + ga;
  const i_P_P = seriesRcIm(rload1, cout1, om) + om * v[AC_CSTRAY1] + wpk + wgp;
  const r_P_K = -ga - gm;
  const i_P_K = -wpk;
  const r_P_G = gm;
  const i_P_G = -wgp;
  const r_K_P = -ga;
  const i_K_P = -wpk;
  let r_K_K = ga + gm + seriesRcRe(rload2, cout2, om);
  let i_K_K = seriesRcIm(rload2, cout2, om) + om * v[AC_CSTRAY2] + wpk + wgk;
  let r_K_G = -gm;
  let i_K_G = -wgk;
  // Rb from K to J; with Rb = 0, J is the cathode: row K takes J's branches (Rt, the grid leak)
  // and row J says gt·(vJ − vK) = 0 (scaled like the other rows).
  let r_K_J: number;
  let r_J_K: number;
  let r_J_J: number;
  let r_J_G: number;
  if (rb > 0) {
    const gb = 1 / rb;
    r_K_K += gb;
    r_K_J = -gb;
    r_J_K = -gb;
    r_J_J = gb + gt + gg;
    r_J_G = -gg;
  } else {
    r_K_K += gt + gg;
    r_K_G -= gg;
    r_K_J = 0;
    r_J_K = -gt;
    r_J_J = gt;
    r_J_G = 0;
  }
  // Grid: the leak to J, Cgk, Cgp and the source; or held at 1 V.
  const i_G_P = held ? 0 : -wgp;
  let i_G_K = held ? 0 : -wgk;
  let r_G_K = 0;
  let r_G_J = held ? 0 : -gg;
  let i_G_J = 0;
  let r_G_G = held ? 1 : gg + ysr;
  let i_G_G = held ? 0 : wgk + wgp + ysi;
  const br = held ? 1 : ysr;
  const bi = held ? 0 : ysi;
  // Pivot P: eliminate the plate column from rows K and G (row J has no plate term).
  const dP = r_P_P * r_P_P + i_P_P * i_P_P;
  const irP = r_P_P / dP;
  const iiP = -i_P_P / dP;
  const lrK = r_K_P * irP - i_K_P * iiP;
  const liK = r_K_P * iiP + i_K_P * irP;
  r_K_K -= lrK * r_P_K - liK * i_P_K;
  i_K_K -= lrK * i_P_K + liK * r_P_K;
  r_K_G -= lrK * r_P_G - liK * i_P_G;
  i_K_G -= lrK * i_P_G + liK * r_P_G;
  const lrG = -i_G_P * iiP;
  const liG = i_G_P * irP;
  r_G_K -= lrG * r_P_K - liG * i_P_K;
  i_G_K -= lrG * i_P_K + liG * r_P_K;
  r_G_G -= lrG * r_P_G - liG * i_P_G;
  i_G_G -= lrG * i_P_G + liG * r_P_G;
  // Pivot K: eliminate the cathode column from rows J and G.
  const dK = r_K_K * r_K_K + i_K_K * i_K_K;
  const irK = r_K_K / dK;
  const iiK = -i_K_K / dK;
  const lrJ = r_J_K * irK;
  const liJ = r_J_K * iiK;
  r_J_J -= lrJ * r_K_J;
  const i_J_J = -liJ * r_K_J;
  r_J_G -= lrJ * r_K_G - liJ * i_K_G;
  const i_J_G = -(lrJ * i_K_G + liJ * r_K_G);
  const lrG2 = r_G_K * irK - i_G_K * iiK;
  const liG2 = r_G_K * iiK + i_G_K * irK;
  r_G_J -= lrG2 * r_K_J;
  i_G_J -= liG2 * r_K_J;
  r_G_G -= lrG2 * r_K_G - liG2 * i_K_G;
  i_G_G -= lrG2 * i_K_G + liG2 * r_K_G;
  // Pivot J: eliminate the junction column from row G.
  const dJ = r_J_J * r_J_J + i_J_J * i_J_J;
  const irJ = r_J_J / dJ;
  const iiJ = -i_J_J / dJ;
  const lrG3 = r_G_J * irJ - i_G_J * iiJ;
  const liG3 = r_G_J * iiJ + i_G_J * irJ;
  r_G_G -= lrG3 * r_J_G - liG3 * i_J_G;
  i_G_G -= lrG3 * i_J_G + liG3 * r_J_G;
  // Back substitution: grid, junction, cathode, plate.
  const dG = r_G_G * r_G_G + i_G_G * i_G_G;
  const gr = (br * r_G_G + bi * i_G_G) / dG;
  const gi = (bi * r_G_G - br * i_G_G) / dG;
  const sjr = -(r_J_G * gr - i_J_G * gi);
  const sji = -(r_J_G * gi + i_J_G * gr);
  const jr = sjr * irJ - sji * iiJ;
  const ji = sjr * iiJ + sji * irJ;
  const skr = -(r_K_J * jr) - (r_K_G * gr - i_K_G * gi);
  const ski = -(r_K_J * ji) - (r_K_G * gi + i_K_G * gr);
  const kr = skr * irK - ski * iiK;
  const ki = skr * iiK + ski * irK;
  const spr = -(r_P_K * kr - i_P_K * ki) - (r_P_G * gr - i_P_G * gi);
  const spi = -(r_P_K * ki + i_P_K * kr) - (r_P_G * gi + i_P_G * gr);
  const pr = spr * irP - spi * iiP;
  const pi = spr * iiP + spi * irP;
  if (!(Number.isFinite(pr) && Number.isFinite(pi) && Number.isFinite(kr) && Number.isFinite(ki)))
    return false;
  divideLoad(pr, pi, rload1, cout1, om, out, H1_RE);
  divideLoad(kr, ki, rload2, cout2, om, out, H2_RE);
  return true;
}
