import type { ResolvedDesign } from '../design/designSchema.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import type { BiasStatus } from './biasSolver.js';
import { createStageContext, nominalStageInputs, solveStageBias } from './stageEvaluator.js';
import { createStagePoint, type MetricValues } from './stagePoint.js';
import { ratingWarnings, type StageWarning } from './ratingWarnings.js';
import { solveSplitLoadBiasInto } from './splitLoadBias.js';
import { trimRl2, type TrimResult } from './trimRl2.js';

/** The nominal report of a design: bias point, small signal, trim and warnings. */
export interface NominalReport {
  /** 'ok', or why the design has no valid bias point. */
  status: BiasStatus;
  /** One-line explanation when status is not 'ok'. */
  diagnosis?: string;
  /** Every metric at nominal (SI units: A, V, Ω, S, W, dB); NaN when status is not 'ok'. */
  metrics: MetricValues;
  /** Ratings exceeded at nominal. */
  warnings: StageWarning[];
  /** The tube's maximum ratings the warnings compare against (W, V). */
  ratings: { plateDissipation: number; plateVoltage: number; heaterCathode: number };
  /** The RL2 that balances the outputs; absent when there is no valid bias. */
  trim?: TrimResult;
}

const DIAGNOSIS: Record<Exclude<BiasStatus, 'ok'>, string> = {
  'supply-too-low': 'B+ must be positive and above the tail supply; no current can flow',
  'cut-off':
    'a section is cut off (plate current below 1 µA): grid bias too negative for this B+ and these resistors',
  'grid-current':
    'a grid sits positive to its cathode: grid current would flow, which the triode model does not cover; lower the grid drive, raise Rk/Rt or raise B+',
  'invalid-parts': 'a resistance or tube multiplier is zero, negative or not a number',
  'no-convergence': 'the bias point solver did not converge; check that part values are physically sensible',
};

/**
 * Everything the nominal view shows for a design, in one call: DC operating point, gm/rp/mu of
 * each section, midband gains, impedances, balance, CMRR, rating warnings and the trim. For a
 * 'split-load' design: one section, a11/a12 the plate/cathode gains, no trim, and the metrics of
 * SPLIT_LOAD_NAN_METRICS NaN (see createSplitLoadKernel). Pure and
 * synchronous, so the web editor can run it on every keystroke.
 *
 * @example
 * const r = nominalResults(design);
 * r.metrics.balanceDb; // e.g. −0.8 (dB)
 * r.trim?.e24.rl2; // e.g. 91000 (Ω)
 */
export function nominalResults(design: ResolvedDesign): NominalReport {
  const ctx = createStageContext(design);
  const tube = TUBE_CATALOG[design.tube.type];
  const ratings = {
    plateDissipation: tube.maxPlateDissipation.value,
    plateVoltage: tube.maxPlateVoltage.value,
    heaterCathode: tube.maxHeaterCathode.value,
  };
  const splitLoad = design.topology === 'split-load';
  const status = splitLoad
    ? solveSplitLoadBiasInto({ ...ctx.bias, ...nominalStageInputs(design) }, ctx.bp, false)
    : solveStageBias(ctx, nominalStageInputs(design), false);
  const metrics = createStagePoint(design)();
  if (status !== 'ok') {
    const why = DIAGNOSIS[status];
    const vgk = splitLoad ? ctx.bp.vgk1 : Math.max(ctx.bp.vgk1, ctx.bp.vgk2);
    const detail = status === 'grid-current' ? ` (Vgk = ${Number(vgk.toPrecision(3))} V)` : '';
    return { status, diagnosis: why + detail, metrics, warnings: [], ratings };
  }
  return {
    status,
    metrics,
    warnings: ratingWarnings(tube, metrics, design.supply.bPlus),
    ratings,
    // The RL2 trim balances a long-tailed pair; a split-load design has no RL2.
    trim: splitLoad ? undefined : trimRl2(design),
  };
}
