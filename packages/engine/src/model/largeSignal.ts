import type { ResolvedDesign } from '../design/designSchema.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import { korenCurrent, type KorenParams } from '../tubes/korenTriode.js';
import { solveDenseInPlace } from './denseSolve.js';
import { nominalStageInputs, type StageInputs } from './stageEvaluator.js';

/** The pair at one instant of a slow (quasi-static) grid-1 signal: volts and amperes. */
export interface LargeSignalPoint {
  va1: number;
  va2: number;
  vk: number;
  vj: number;
  ia1: number;
  ia2: number;
  vgk1: number;
  vgk2: number;
}

/**
 * The quasi-static large-signal model of a stage (see {@link createLargeSignalStage}).
 */
export interface LargeSignalStage {
  /** The resting point (drive 0); null when the Newton solve finds none. */
  readonly rest: LargeSignalPoint | null;
  /** The pair with `vin` volts added to grid 1 (a new object); null if the solve fails. */
  at(vin: number): LargeSignalPoint | null;
}

/**
 * Builds the quasi-static large-signal model of a design, at nominal part values or at `x`
 * (kernel inputs: ohms, tube multipliers). No small-signal approximation: the DC node equations of
 * the pair with the triode model, grid 1 at its resting potential plus the instantaneous drive,
 * grid 2 held at its resting potential (its bypass), each plate loaded by RL to B+ and by its load
 * returned to the plate's resting voltage (the charged coupling capacitor). In the cap-coupled
 * form the grid leaks carry the grids' offset from J. Source resistance and the other capacitors
 * are left out (a midband signal slow against the tube's own capacitances). Newton on
 * (Va1, Va2, Vk, VJ) with a difference Jacobian, warm-started from the last point asked for.
 *
 * @example
 * const s = createLargeSignalStage(design);
 * s.at(1)?.va1; // plate 1 with grid 1 one volt above rest (V)
 */
export function createLargeSignalStage(
  design: ResolvedDesign,
  x: StageInputs = nominalStageInputs(design),
): LargeSignalStage {
  const tube: KorenParams = TUBE_CATALOG[design.tube.type].model;
  const cap = design.topology === 'cap-coupled';
  const bPlus = design.supply.bPlus;
  const tail = design.supply.tail;
  const grid2 = design.drive?.grid2;
  const g1dc = cap ? 0 : (design.drive?.grid1Dc ?? 0);
  const g2dc = cap ? 0 : grid2?.mode === 'fixed' ? grid2.dc : g1dc;
  const gl1 = cap ? 1 / x.rg1 : 0;
  const gl2 = cap ? 1 / x.rg2 : 0;
  const i1 = (vpk: number, vgk: number) => korenCurrent(tube, vpk, vgk, x.perv1, x.mu1);
  const i2 = (vpk: number, vgk: number) => korenCurrent(tube, vpk, vgk, x.perv2, x.mu2);
  // Set once the rest point is known: grid potentials, plate rest voltages, the loads (off at
  // rest, where they carry no current).
  let restGrids = true;
  let vg2 = g2dc;
  let vp1Rest = 0;
  let vp2Rest = 0;
  let gload1 = 0;
  let gload2 = 0;
  const state = Float64Array.of(bPlus * 0.6, bPlus * 0.6, 2, 1);
  const f = new Float64Array(4);
  const fd = new Float64Array(4);
  const jac = new Float64Array(16);
  const step = new Float64Array(4);
  const residual = (s: Float64Array, vg1: number, out: Float64Array) => {
    const va1 = s[0];
    const va2 = s[1];
    const vk = s[2];
    const vj = s[3];
    const g1 = restGrids && cap ? vj : vg1;
    const g2 = restGrids && cap ? vj : vg2;
    const a1 = i1(va1 - vk, g1 - vk);
    const a2 = i2(va2 - vk, g2 - vk);
    out[0] = (bPlus - va1) / x.rl1 + (vp1Rest - va1) * gload1 - a1;
    out[1] = (bPlus - va2) / x.rl2 + (vp2Rest - va2) * gload2 - a2;
    out[2] = a1 + a2 - (vk - vj) / x.rk;
    out[3] = (vk - vj) / x.rk + gl1 * (g1 - vj) + gl2 * (g2 - vj) - (vj - tail) / x.rt;
  };
  const solve = (vg1: number): boolean => {
    for (let it = 0; it < 200; it++) {
      residual(state, vg1, f);
      for (let j = 0; j < 4; j++) {
        const h = 1e-7 * Math.max(1, Math.abs(state[j]));
        const keep = state[j];
        state[j] = keep + h;
        residual(state, vg1, fd);
        state[j] = keep;
        for (let i = 0; i < 4; i++) jac[i * 4 + j] = (fd[i] - f[i]) / h;
      }
      for (let i = 0; i < 4; i++) step[i] = -f[i];
      if (!solveDenseInPlace(jac, step, 4)) return false;
      // Damped: no node moves by more than 10 V per step, and no plate goes below its cathode.
      let big = 0;
      for (let i = 0; i < 4; i++) big = Math.max(big, Math.abs(step[i]));
      const k = big > 10 ? 10 / big : 1;
      for (let i = 0; i < 4; i++) state[i] += k * step[i];
      if (!state.every(Number.isFinite)) return false;
      if (big * k < 1e-11 * Math.max(1, bPlus)) return true;
    }
    return false;
  };
  const point = (vg1: number): LargeSignalPoint => {
    const va1 = state[0];
    const va2 = state[1];
    const vk = state[2];
    const vj = state[3];
    const g1 = restGrids && cap ? vj : vg1;
    const g2 = restGrids && cap ? vj : vg2;
    return {
      ...{ va1, va2, vk, vj, vgk1: g1 - vk, vgk2: g2 - vk },
      ...{ ia1: i1(va1 - vk, g1 - vk), ia2: i2(va2 - vk, g2 - vk) },
    };
  };
  const rest = solve(g1dc) ? point(g1dc) : null;
  if (!rest) return { rest, at: () => null };
  restGrids = false;
  const vg1Rest = cap ? rest.vj : g1dc;
  vg2 = cap ? rest.vj : g2dc;
  vp1Rest = rest.va1;
  vp2Rest = rest.va2;
  gload1 = Number.isFinite(x.rload1) ? 1 / x.rload1 : 0;
  gload2 = Number.isFinite(x.rload2) ? 1 / x.rload2 : 0;
  const restState = state.slice();
  return {
    rest,
    at(vin) {
      const vg1 = vg1Rest + vin;
      if (solve(vg1)) return point(vg1);
      // A far jump can fail from the last point: retry from rest.
      state.set(restState);
      return solve(vg1) ? point(vg1) : null;
    },
  };
}
