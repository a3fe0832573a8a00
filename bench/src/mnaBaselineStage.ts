import { Matrix, solve } from 'ml-matrix';
import { korenPointInto, TUBE_CATALOG, type ResolvedDesign, type TriodePoint } from '@sigmatail/engine';

// Node numbers of the cap-coupled stage (0 = ground). AC: B+ and the tail supply are AC ground;
// coupling capacitors are shorts, so Rload_i sits from plate i to ground.
const P1 = 1;
const P2 = 2;
const K = 3;
const J = 4;
const G1 = 5;
const G2 = 6;
const S1 = 7; // source node ahead of Rsource
const BP = 8; // B+ (DC only)
const TAIL = 9; // tail supply (DC only)

type Stamper = { a: number[][]; size: number };

function resistor(m: Stamper, n1: number, n2: number, r: number): void {
  if (!Number.isFinite(r)) return;
  const g = 1 / r;
  if (n1) m.a[n1 - 1][n1 - 1] += g;
  if (n2) m.a[n2 - 1][n2 - 1] += g;
  if (n1 && n2) {
    m.a[n1 - 1][n2 - 1] -= g;
    m.a[n2 - 1][n1 - 1] -= g;
  }
}

/** Current g·(v(c1) − v(c2)) flowing from node `from` into node `to` (through the device). */
function vccs(m: Stamper, from: number, to: number, c1: number, c2: number, g: number): void {
  for (const [row, sign] of [
    [from, 1],
    [to, -1],
  ] as const) {
    if (!row) continue;
    if (c1) m.a[row - 1][c1 - 1] += sign * g;
    if (c2) m.a[row - 1][c2 - 1] -= sign * g;
  }
}

/** Voltage source row `k` (after the node rows): v(n) = value, branch current as extra unknown. */
function voltageSource(m: Stamper, k: number, n: number): void {
  m.a[k][n - 1] = 1;
  m.a[n - 1][k] = 1;
}

function blank(size: number): Stamper {
  return { a: Array.from({ length: size }, () => new Array<number>(size).fill(0)), size };
}

/**
 * The general, unreduced baseline: per sample, stamp every element of the stage (resistors,
 * triodes as VCCS pairs, supplies and inputs as voltage sources) into a modified nodal analysis
 * matrix and solve it with ml-matrix's LU. The DC point uses Newton iterations, each stamping the
 * linearised triodes (companion model) and solving the full MNA system. Cap-coupled designs only.
 */
export function createMnaBaselineStage(design: ResolvedDesign, dcPerSample: boolean) {
  const tube = TUBE_CATALOG[design.tube.type].model;
  const bPlus = design.supply.bPlus;
  const vTail = design.supply.tail;
  const t1: TriodePoint = { ia: 0, gm: 0, ga: 0 };
  const t2: TriodePoint = { ia: 0, gm: 0, ga: 0 };

  /** Newton on the 9-node DC MNA system; returns node voltages, leaves t1/t2 at the solution. */
  function solveDc(x: Float64Array, start: number[]): number[] {
    let v = [...start];
    for (let it = 0; it < 50; it++) {
      iterations++;
      korenPointInto(tube, v[P1 - 1] - v[K - 1], v[G1 - 1] - v[K - 1], x[11], x[9], t1);
      korenPointInto(tube, v[P2 - 1] - v[K - 1], v[G2 - 1] - v[K - 1], x[12], x[10], t2);
      const m = blank(11);
      const rhs = new Array<number>(11).fill(0);
      resistor(m, BP, P1, x[0]);
      resistor(m, BP, P2, x[1]);
      resistor(m, K, J, x[2]);
      resistor(m, J, TAIL, x[3]);
      resistor(m, G1, J, x[4]);
      resistor(m, G2, J, x[5]);
      // The input is capacitor-coupled: in DC the source node only hangs on Rsource.
      resistor(m, S1, G1, Math.max(x[8], 1));
      for (const [t, p, g] of [
        [t1, P1, G1],
        [t2, P2, G2],
      ] as const) {
        vccs(m, p, K, g, K, t.gm);
        vccs(m, p, K, p, K, t.ga);
        // Companion current source: Ia0 − gm·vgk0 − ga·vpk0 from plate to cathode.
        const ieq = t.ia - t.gm * (v[g - 1] - v[K - 1]) - t.ga * (v[p - 1] - v[K - 1]);
        rhs[p - 1] -= ieq;
        rhs[K - 1] += ieq;
      }
      voltageSource(m, 9, BP);
      rhs[9] = bPlus;
      voltageSource(m, 10, TAIL);
      rhs[10] = vTail;
      const sol = solve(new Matrix(m.a), Matrix.columnVector(rhs)).getColumn(0);
      let worst = 0;
      for (let i = 0; i < 9; i++) worst = Math.max(worst, Math.abs(sol[i] - v[i]));
      v = sol.slice(0, 9);
      // Converged when no node moves by more than 1 nV per volt of B+ (round-off level of the LU).
      if (worst < 1e-9 * bPlus) break;
    }
    return v;
  }
  let iterations = 0;

  return {
    /** Newton iterations so far (all samples). */
    iterations: () => iterations,
    /** Evaluates samples 0..n-1 (inputs in the kernel's INPUTS order); writes a11 into out. */
    evaluate(inputs: readonly Float64Array[], n: number, out: Float64Array, nominalDc: number[]): void {
      const x = new Float64Array(13);
      const vk = nominalDc[2];
      const vj = nominalDc[3];
      const start = [nominalDc[0], nominalDc[1], vk, vj, vj, vj, 0, bPlus, vTail];
      korenPointInto(tube, nominalDc[0] - vk, vj - vk, 1, 1, t1);
      const nom1 = { ...t1 };
      korenPointInto(tube, nominalDc[1] - vk, vj - vk, 1, 1, t2);
      const nom2 = { ...t2 };
      for (let s = 0; s < n; s++) {
        for (let i = 0; i < 13; i++) x[i] = inputs[i][s];
        let g1: TriodePoint = t1;
        let g2: TriodePoint = t2;
        if (dcPerSample) solveDc(x, start);
        else {
          g1 = { ia: nom1.ia, ga: nom1.ga * x[11], gm: (nom1.gm / nom1.ga) * x[9] * nom1.ga * x[11] };
          g2 = { ia: nom2.ia, ga: nom2.ga * x[12], gm: (nom2.gm / nom2.ga) * x[10] * nom2.ga * x[12] };
        }
        // AC: 7 nodes + 2 input sources.
        const m = blank(9);
        resistor(m, P1, 0, x[0]);
        resistor(m, P2, 0, x[1]);
        resistor(m, K, J, x[2]);
        resistor(m, J, 0, x[3]);
        resistor(m, G1, J, x[4]);
        resistor(m, G2, J, x[5]);
        resistor(m, P1, 0, x[6]);
        resistor(m, P2, 0, x[7]);
        resistor(m, S1, G1, Math.max(x[8], 1e-6));
        vccs(m, P1, K, G1, K, g1.gm);
        vccs(m, P1, K, P1, K, g1.ga);
        vccs(m, P2, K, G2, K, g2.gm);
        vccs(m, P2, K, P2, K, g2.ga);
        voltageSource(m, 7, S1);
        voltageSource(m, 8, G2);
        const rhs = Array.from({ length: 9 }, () => [0, 0]);
        rhs[7] = [1, 0];
        rhs[8] = [0, 1];
        out[s] = solve(new Matrix(m.a), new Matrix(rhs)).get(P1 - 1, 0);
      }
    },
  };
}
