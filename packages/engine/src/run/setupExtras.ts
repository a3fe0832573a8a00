import { assembleExtras, EXTRAS_PARTS, runExtrasPart } from './extrasParts.js';
import type { RunResults } from './runResults.js';
import type { RunPlan } from './runPlan.js';
import type { RunSetup } from './runSetup.js';

/**
 * Work done once per run rather than per chunk: nominal metrics, influence (local sensitivities,
 * Spearman/SRRC on the first min(N, 20 000) samples regenerated from the run's own chunks,
 * tornado), variance-based indices (their own A/B samples, VARIANCE_BASE_SAMPLES·(d+2)
 * evaluations) and worst case, as switched on in plan.analyses (all on by default); for a setup
 * made by designSetup (which keeps the design), the per-sample large-signal figures when
 * plan.analyses.largeSignal is true. Pure function of (setup, plan): every part of EXTRAS_PARTS in turn (a server worker
 * runs them as parallel tasks instead). mergeChunks calls it unless given precomputed extras.
 */
export function setupExtras(setup: RunSetup, plan: RunPlan): Partial<RunResults> {
  return assembleExtras(
    setup,
    EXTRAS_PARTS.map((_p, i) => runExtrasPart(setup, plan, i)),
  );
}
