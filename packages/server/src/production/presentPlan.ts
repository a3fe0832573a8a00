import type { Database } from '@sigmatail/db';
import { wilsonInterval } from '@sigmatail/engine';
import type { Kysely } from 'kysely';
import { findRun } from '../runs/runsRepo.js';
import type { findPlan } from './productionRepo.js';

type PlanRow = NonNullable<Awaited<ReturnType<typeof findPlan>>>;

/**
 * A saved plan as the API shows it, with its confirming run's status and, once done, the run's
 * reject rate and 95 % Wilson interval in PPM (to set beside the search's estimate).
 */
export async function presentPlan(db: Kysely<Database>, workspaceId: string, p: PlanRow) {
  const run = p.confirm_run_id ? await findRun(db, workspaceId, p.confirm_run_id) : undefined;
  let confirm = null;
  if (run) {
    const jy = run.summary?.jointYield ?? null;
    const interval = jy === null ? null : wilsonInterval(Math.round(jy * run.samples), run.samples);
    confirm = {
      runId: run.id,
      status: run.status,
      samples: run.samples,
      seed: run.seed,
      revision: run.revision,
      rejectPpm: jy === null ? null : (1 - jy) * 1e6,
      lowPpm: interval ? (1 - interval[1]) * 1e6 : null,
      highPpm: interval ? (1 - interval[0]) * 1e6 : null,
    };
  }
  return {
    id: p.id,
    designId: p.design_id,
    designName: p.design_name,
    revision: p.revision,
    target: p.target,
    result: p.result,
    assignment: p.assignment,
    confirmRevision: p.confirm_revision,
    confirm,
    createdAt: p.created_at,
  };
}
