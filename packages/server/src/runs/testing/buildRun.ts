import crypto from 'node:crypto';
import type { RunStatus } from '@sigmatail/db';
import { ENGINE_VERSION } from '@sigmatail/engine';
import { insertRunChunks, queuedTasks } from '../insertRunChunks.js';
import type { Db } from '../runsDb.js';
import { EXTRAS_INDEX } from '../../worker/runJob.js';

type Overrides = Partial<{
  samples: number;
  chunkSize: number;
  seed: string;
  design: unknown;
  status: RunStatus;
  /** Queue the once-per-run work as one task (EXTRAS_INDEX), as runs launched before the split did. */
  legacyExtras: boolean;
  /** Once-per-run parts to queue (default: the engine's); queue tests use fewer. */
  extrasTasks: number;
}>;

/** Builder fixture: a workspace, a user and a design to hang runs on. */
export async function buildOwner(db: Db): Promise<{ workspaceId: string; userId: string; designId: string }> {
  const tag = crypto.randomBytes(4).toString('hex');
  const ws = await db
    .insertInto('workspaces')
    .values({ name: `Fixture works ${tag}`, settings: '{}' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const user = await db
    .insertInto('users')
    .values({ email: `owner-${tag}@fixture.example`, name: 'Fixture Owner', password_hash: 'x' })
    .returning('id')
    .executeTakeFirstOrThrow();
  const design = await db
    .insertInto('designs')
    .values({ workspace_id: ws.id, name: `Fixture stage ${tag}`, created_by: user.id, latest_rev: 1 })
    .returning('id')
    .executeTakeFirstOrThrow();
  return { workspaceId: ws.id, userId: user.id, designId: design.id };
}

/** Builder fixture: inserts a queued run (and its chunk rows) directly, as a launch would. */
export async function buildRun(db: Db, o: Overrides = {}): Promise<string> {
  const owner = await buildOwner(db);
  const samples = o.samples ?? 10_000;
  const chunkSize = o.chunkSize ?? 1_000;
  const chunkTotal = Math.ceil(samples / chunkSize);
  const run = await db
    .insertInto('runs')
    .values({
      workspace_id: owner.workspaceId,
      design_id: owner.designId,
      revision: 1,
      created_by: owner.userId,
      samples,
      seed: o.seed ?? 'fixture-seed',
      plan: 'random',
      chunk_size: chunkSize,
      analyses: '{}',
      design: JSON.stringify(o.design ?? { spinPerSample: 1 }),
      engine_version: ENGINE_VERSION,
      chunk_total: o.legacyExtras ? chunkTotal + 1 : queuedTasks(chunkTotal, o.extrasTasks),
      status: o.status,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await insertRunChunks(db, run.id, chunkTotal, o.extrasTasks);
  if (o.legacyExtras) {
    await db.deleteFrom('run_chunks').where('run_id', '=', run.id).where('chunk_index', '<', 0).execute();
    await db.insertInto('run_chunks').values({ run_id: run.id, chunk_index: EXTRAS_INDEX }).execute();
  }
  return run.id;
}
