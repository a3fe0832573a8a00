import { sql } from 'kysely';
import type { Db, RunsTable } from '../runsDb.js';

type Overrides = Partial<{
  samples: number;
  chunkSize: number;
  seed: string;
  design: unknown;
  status: RunsTable['status']['__select__'];
}>;

/** Builder fixture: inserts a queued run (and its chunk rows) directly, as a launch would. */
export async function buildRun(db: Db, o: Overrides = {}): Promise<string> {
  const samples = o.samples ?? 10_000;
  const chunkSize = o.chunkSize ?? 1_000;
  const chunkTotal = Math.ceil(samples / chunkSize);
  const run = await db
    .insertInto('runs')
    .values({
      workspace_id: 1,
      design_id: 1,
      revision: 1,
      created_by: 1,
      samples,
      seed: o.seed ?? 'fixture-seed',
      plan: 'random',
      chunk_size: chunkSize,
      analyses: '{}',
      design: JSON.stringify(o.design ?? { spinPerSample: 1 }),
      engine_version: 'test',
      chunk_total: chunkTotal,
      status: o.status,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await sql`insert into run_chunks (run_id, chunk_index)
    select ${run.id}::uuid, g from generate_series(0, ${chunkTotal - 1}::int) g`.execute(db);
  return run.id;
}
