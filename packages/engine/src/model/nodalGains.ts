import { createStageGains, type StageGains } from './closedFormGains.js';
import { solveDenseInPlace } from './denseSolve.js';
import type { SmallSignalCircuit } from './reducedNodalGains.js';

// Modified nodal analysis: node voltages P1 P2 K J G1 G2 S1, then the currents of the two drive
// sources (V1 at S1 behind Rsource, V2 at G2). Ground is eliminated.
const P1 = 0;
const P2 = 1;
const K = 2;
const J = 3;
const G1 = 4;
const G2 = 5;
const S1 = 6;
const IV1 = 7;
const IV2 = 8;
const N = 9;
const GND = -1;

type Case = { e1: number; e2: number; inject: number; dropLoad: number; idealSource: boolean };

function stampG(a: Float64Array, p: number, q: number, g: number): void {
  if (p !== GND) a[p * N + p] += g;
  if (q !== GND) a[q * N + q] += g;
  if (p !== GND && q !== GND) {
    a[p * N + q] -= g;
    a[q * N + p] -= g;
  }
}

/** Transconductance gm·(v_c − v_d) flowing out of node p, into node q. */
function stampVccs(a: Float64Array, p: number, q: number, c: number, d: number, gm: number): void {
  a[p * N + c] += gm;
  a[p * N + d] -= gm;
  a[q * N + c] -= gm;
  a[q * N + d] += gm;
}

function solveCase(c: SmallSignalCircuit, k: Case): Float64Array {
  const a = new Float64Array(N * N);
  const b = new Float64Array(N);
  stampG(a, P1, GND, 1 / c.rl1);
  stampG(a, P2, GND, 1 / c.rl2);
  if (k.dropLoad !== 1 && Number.isFinite(c.rload1)) stampG(a, P1, GND, 1 / c.rload1);
  if (k.dropLoad !== 2 && Number.isFinite(c.rload2)) stampG(a, P2, GND, 1 / c.rload2);
  stampG(a, P1, K, 1 / c.rp1);
  stampG(a, P2, K, 1 / c.rp2);
  stampVccs(a, P1, K, G1, K, c.mu1 / c.rp1);
  stampVccs(a, P2, K, G2, K, c.mu2 / c.rp2);
  stampG(a, K, J, 1 / c.rk);
  stampG(a, J, GND, 1 / c.rt);
  if (c.capCoupled) {
    stampG(a, G1, J, 1 / c.rg1);
    stampG(a, G2, J, 1 / c.rg2);
  } else if (c.leakToGrid1) stampG(a, G1, G2, 1 / c.rg2);
  const viaSource = !k.idealSource && c.rsource > 0;
  const v1Node = viaSource ? S1 : G1;
  if (viaSource) stampG(a, S1, G1, 1 / c.rsource);
  else stampG(a, S1, GND, 1); // S1 unused: keep its row non-singular
  a[v1Node * N + IV1] += 1;
  a[IV1 * N + v1Node] += 1;
  b[IV1] = k.e1;
  a[G2 * N + IV2] += 1;
  a[IV2 * N + G2] += 1;
  b[IV2] = k.e2;
  if (k.inject === 1) b[P1] += 1;
  if (k.inject === 2) b[P2] += 1;
  if (!solveDenseInPlace(a, b, N)) b.fill(Number.NaN);
  return b;
}

/**
 * Reference midband solver: full modified nodal analysis of the pair (plates, cathode, tail
 * junction, grids, source node) with a general dense solve. Slower than the hand-reduced solve
 * the kernel uses, and written independently of it, so tests hold one against the other.
 * Same conventions as {@link reducedNodalGainsInto}.
 *
 * @example
 * nodalGains(circuit).a11;
 */
export function nodalGains(c: SmallSignalCircuit): StageGains {
  const out = createStageGains();
  const base = { inject: 0, dropLoad: 0, idealSource: false };
  const d1 = solveCase(c, { ...base, e1: 1, e2: 0 });
  out.a11 = d1[P1];
  out.a12 = d1[P2];
  const d2 = solveCase(c, { ...base, e1: 0, e2: 1 });
  out.a21 = d2[P1];
  out.a22 = d2[P2];
  out.zout1 = solveCase(c, { ...base, e1: 0, e2: 0, inject: 1, dropLoad: 1 })[P1];
  out.zout2 = solveCase(c, { ...base, e1: 0, e2: 0, inject: 2, dropLoad: 2 })[P2];
  const zin = solveCase(c, { ...base, e1: 1, e2: 0, idealSource: true });
  const iin = -zin[IV1];
  out.zin = Math.abs(iin) > 1e-300 ? 1 / iin : Number.POSITIVE_INFINITY;
  return out;
}
