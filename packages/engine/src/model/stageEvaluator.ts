import type { ResolvedDesign } from '../design/designSchema.js';
import { TUBE_CATALOG, type TubeSpec } from '../tubes/tubeCatalog.js';
import { createBiasPoint, solveBiasInto, type BiasCircuit, type BiasPoint } from './biasSolver.js';
import { createStageGains, type StageGains } from './closedFormGains.js';
import type { SmallSignalCircuit } from './reducedNodalGains.js';

/** Per-sample values of the kernel inputs (Ω; multipliers dimensionless). Same names as INPUTS. */
export interface StageInputs {
  rl1: number;
  rl2: number;
  rk: number;
  rt: number;
  rg1: number;
  rg2: number;
  rload1: number;
  rload2: number;
  rsource: number;
  /** Capacitors (F): coupling and bypass Infinity when ideal, stray 0 when absent. */
  cin: number;
  cg2: number;
  cout1: number;
  cout2: number;
  cstray1: number;
  cstray2: number;
  mu1: number;
  mu2: number;
  perv1: number;
  perv2: number;
}

/** Reusable per-design state: the circuit templates and scratch results (allocated once). */
export interface StageContext {
  tube: TubeSpec;
  bias: BiasCircuit;
  bp: BiasPoint;
  ss: SmallSignalCircuit;
  gains: StageGains;
  /** Heater potential to ground (V). */
  heater: number;
  /** true when grid leaks, loads and source resistance are absent, so the closed form is exact. */
  closedForm: boolean;
}

/**
 * Nominal kernel inputs of a design: part values in ohms and farads, absent loads = Infinity,
 * absent source resistance = 0, absent coupling/bypass capacitors = Infinity (ideal), absent
 * stray capacitances = 0, tube multipliers 1.
 *
 * @example
 * nominalStageInputs(design).rl1; // 100000
 */
export function nominalStageInputs(d: ResolvedDesign): StageInputs {
  const p = d.parts;
  return {
    ...{
      rl1: p.rl1.value,
      // Absent only in a split-load design, which never reads them: copies keep the inputs finite.
      rl2: p.rl2?.value ?? p.rl1.value,
      rk: p.rk.value,
      rt: p.rt.value,
      rg1: p.rg1.value,
      rg2: p.rg2?.value ?? p.rg1.value,
    },
    rload1: p.rload1?.value ?? Number.POSITIVE_INFINITY,
    rload2: p.rload2?.value ?? Number.POSITIVE_INFINITY,
    rsource: p.rsource?.value ?? 0,
    cin: p.cin?.value ?? Number.POSITIVE_INFINITY,
    cg2: p.cg2?.value ?? Number.POSITIVE_INFINITY,
    cout1: p.cout1?.value ?? Number.POSITIVE_INFINITY,
    cout2: p.cout2?.value ?? Number.POSITIVE_INFINITY,
    cstray1: p.cstray1?.value ?? 0,
    cstray2: p.cstray2?.value ?? 0,
    ...{ mu1: 1, mu2: 1, perv1: 1, perv2: 1 },
  };
}

/**
 * Builds the reusable evaluation context of a design.
 *
 * @example
 * const ctx = createStageContext(design);
 */
export function createStageContext(d: ResolvedDesign): StageContext {
  const tube = TUBE_CATALOG[d.tube.type];
  const cap = d.topology === 'cap-coupled';
  const g1 = cap ? 0 : (d.drive?.grid1Dc ?? 0);
  const grid2 = d.drive?.grid2;
  const g2 = cap ? 0 : grid2?.mode === 'fixed' ? grid2.dc : g1;
  const nominal = nominalStageInputs(d);
  const bias: BiasCircuit = {
    ...{ capCoupled: cap, bPlus: d.supply.bPlus, tail: d.supply.tail, vg1: g1, vg2: g2 },
    ...{ rl1: 0, rl2: 0, rk: 0, rt: 0, tube: tube.model, perv1: 1, perv2: 1, muScale1: 1, muScale2: 1 },
  };
  const ss: SmallSignalCircuit = {
    ...{ capCoupled: cap, leakToGrid1: !cap && grid2?.mode === 'leak-to-grid1' },
    ...{ mu1: 0, mu2: 0, rp1: 0, rp2: 0, rl1: 0, rl2: 0, rk: 0, rt: 0, rg1: 0, rg2: 0 },
    ...{ rload1: Number.POSITIVE_INFINITY, rload2: Number.POSITIVE_INFINITY, rsource: 0 },
  };
  const closedForm =
    !cap &&
    !ss.leakToGrid1 &&
    nominal.rload1 === Number.POSITIVE_INFINITY &&
    nominal.rload2 === Number.POSITIVE_INFINITY &&
    nominal.rsource === 0;
  return {
    tube,
    bias,
    bp: createBiasPoint(),
    ss,
    gains: createStageGains(),
    heater: d.supply.heater ?? 0,
    closedForm,
  };
}

/**
 * Solves the bias point of one sample into ctx.bp (warm-started from ctx.bp when `warm`);
 * `stepTol` as in {@link solveBiasInto}.
 *
 * @example
 * solveStageBias(ctx, nominalStageInputs(design), false); // 'ok'
 */
export function solveStageBias(
  ctx: StageContext,
  x: StageInputs,
  warm: boolean,
  stepTol = 1e-12,
): BiasPoint['status'] {
  const v = DC_SCRATCH;
  v[DC_RL1] = x.rl1;
  v[DC_RL2] = x.rl2;
  v[DC_RK] = x.rk;
  v[DC_RT] = x.rt;
  v[DC_PERV1] = x.perv1;
  v[DC_PERV2] = x.perv2;
  v[DC_MU1] = x.mu1;
  v[DC_MU2] = x.mu2;
  return solveStageBiasArr(ctx, v, warm, stepTol);
}

/** Slots of the DC scratch array read by {@link solveStageBiasArr} (the bias predictor's order). */
export const DC_RL1 = 0;
export const DC_RL2 = 1;
export const DC_RK = 2;
export const DC_RT = 3;
export const DC_PERV1 = 4;
export const DC_PERV2 = 5;
export const DC_MU1 = 6;
export const DC_MU2 = 7;
/** Length of the DC scratch array. */
export const DC_SLOTS = 8;
// Scratch for the object-input path above (the engine is single-threaded per pool thread).
const DC_SCRATCH = new Float64Array(DC_SLOTS);

/**
 * {@link solveStageBias} with the DC inputs in the DC_* slots of a Float64Array, for the
 * per-sample path (no per-sample object writes of inputs).
 *
 * @example
 * solveStageBiasArr(ctx, dcv, true, 1e-6); // 'ok'
 */
export function solveStageBiasArr(
  ctx: StageContext,
  dcv: Float64Array,
  warm: boolean,
  stepTol: number,
): BiasPoint['status'] {
  const b = ctx.bias;
  b.rl1 = dcv[DC_RL1];
  b.rl2 = dcv[DC_RL2];
  b.rk = dcv[DC_RK];
  b.rt = dcv[DC_RT];
  b.perv1 = dcv[DC_PERV1];
  b.perv2 = dcv[DC_PERV2];
  b.muScale1 = dcv[DC_MU1];
  b.muScale2 = dcv[DC_MU2];
  return solveBiasInto(b, ctx.bp, warm, stepTol);
}
