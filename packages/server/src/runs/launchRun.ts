import crypto from 'node:crypto';
import type { Database } from '@sigmatail/db';
import {
  chunkCount,
  DEFAULT_CHUNK_SIZE,
  ENGINE_VERSION,
  parseDesign,
  runDesignIssues,
  type RunPlan,
} from '@sigmatail/engine';
import type { Kysely } from 'kysely';
import { recordAudit } from '../audit/recordAudit.js';
import type { SessionUser } from '../auth/requireRole.js';
import { HttpError } from '../http/httpError.js';
import { notifyRuns } from '../worker/runsChannel.js';
import { insertRunChunks, queuedTasks } from './insertRunChunks.js';
import type { LaunchRunBody } from './runSchemas.js';

/**
 * Samples per chunk for new runs. Stored with each run (so a run stays reproducible); the env
 * override exists so crash tests can cut small runs into many chunks.
 */
export function launchChunkSize(env: NodeJS.ProcessEnv = process.env): number {
  const n = Number(env.SIGMATAIL_CHUNK_SIZE);
  return Number.isInteger(n) && n >= 1 && n <= 1_048_576 ? n : DEFAULT_CHUNK_SIZE;
}

/**
 * Launches a run: snapshots the design revision, queues its chunks and the once-per-run task,
 * records the audit event and wakes the workers, all in one transaction (the NOTIFY is
 * delivered on commit, so no worker looks before the rows exist).
 */
export async function launchRun(
  db: Kysely<Database>,
  user: SessionUser,
  body: LaunchRunBody,
): Promise<string> {
  const design = await db
    .selectFrom('designs')
    .select(['id', 'latest_rev'])
    .where('workspace_id', '=', user.workspaceId)
    .where('id', '=', body.designId)
    .executeTakeFirst();
  if (!design) throw new HttpError(404, 'design not found', 'designId');
  const revision = body.revision ?? design.latest_rev;
  const rev = await db
    .selectFrom('design_revisions')
    .select('document')
    .where('design_id', '=', design.id)
    .where('rev', '=', revision)
    .executeTakeFirst();
  if (!rev) throw new HttpError(404, `design has no revision ${revision}`, 'revision');
  // Stored revisions passed the schema, but some spreads only fail when the engine sets them up
  // (e.g. a binned part's inner band wider than its tolerance): refuse now, not in a worker.
  const parsed = parseDesign(rev.document);
  const issues = parsed.ok ? runDesignIssues(parsed.design) : parsed.errors;
  if (!parsed.ok || issues.length > 0) {
    const e = issues[0];
    const message = `revision ${revision} cannot run: ${e ? `${e.path}: ${e.message}` : 'invalid design'}`;
    throw new HttpError(422, message, 'revision', issues);
  }
  const plan: RunPlan = {
    samples: body.samples,
    seed: body.seed ?? crypto.randomBytes(8).toString('hex'),
    plan: body.plan,
    chunkSize: launchChunkSize(),
    analyses: body.analyses,
  };
  const chunks = chunkCount(plan);
  return db.transaction().execute(async (trx) => {
    const run = await trx
      .insertInto('runs')
      .values({
        workspace_id: user.workspaceId,
        design_id: design.id,
        revision,
        created_by: user.id,
        samples: plan.samples,
        seed: plan.seed,
        plan: plan.plan,
        chunk_size: plan.chunkSize,
        analyses: JSON.stringify(plan.analyses ?? {}),
        design: JSON.stringify(rev.document),
        engine_version: ENGINE_VERSION,
        chunk_total: queuedTasks(chunks),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await insertRunChunks(trx, run.id, chunks);
    await recordAudit(trx, {
      workspaceId: user.workspaceId,
      userId: user.id,
      action: 'run.launch',
      target: run.id,
      detail: { designId: design.id, revision, samples: plan.samples, seed: plan.seed, plan: plan.plan },
    });
    await notifyRuns(trx, 'launched', run.id);
    return run.id;
  });
}
