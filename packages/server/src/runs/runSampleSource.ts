import { ENGINE_VERSION, parseDesign, type ResolvedDesign, type RunPlan } from '@sigmatail/engine';
import { HttpError } from '../http/httpError.js';
import type { RunView } from './runSchemas.js';
import { findRunDesign, type DbOrTrx } from './runsRepo.js';

/**
 * The design and plan that regenerate a finished run's raw samples (exports, scatter previews).
 * Raw samples are not stored, so only the engine that computed the run can reproduce them: 409
 * for a run of another engine version, 422 when the stored snapshot no longer parses.
 */
export async function runSampleSource(
  db: DbOrTrx,
  run: RunView,
): Promise<{ design: ResolvedDesign; plan: RunPlan }> {
  if (run.engineVersion !== ENGINE_VERSION) {
    throw new HttpError(
      409,
      `run was computed by engine ${run.engineVersion}; this server has ${ENGINE_VERSION}`,
    );
  }
  const parsed = parseDesign(await findRunDesign(db, run.id));
  if (!parsed.ok)
    throw new HttpError(422, 'the run’s design snapshot no longer parses; its samples cannot be regenerated');
  return {
    design: parsed.design,
    plan: {
      samples: run.samples,
      seed: run.seed,
      plan: run.plan,
      chunkSize: run.chunkSize,
      analyses: run.analyses,
    },
  };
}
