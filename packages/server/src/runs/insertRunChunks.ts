import type { Database } from '@sigmatail/db';
import { EXTRAS_PARTS } from '@sigmatail/engine';
import { sql, type Kysely, type Transaction } from 'kysely';
import { extrasPartIndex } from '../worker/runJob.js';

/** Once-per-run tasks of a run: one per part of the engine's once-per-run work. */
export const EXTRAS_TASKS = EXTRAS_PARTS.length;

/**
 * Queues a run's work: one row per sample chunk (0..sampleChunks-1) plus one per once-per-run
 * part (extrasPartIndex(0..extrasTasks-1), i.e. −2, −3, ...). queuedTasks gives the queue
 * length, which is the run's chunk_total (progress denominator).
 */
export async function insertRunChunks(
  db: Kysely<Database> | Transaction<Database>,
  runId: string,
  sampleChunks: number,
  extrasTasks = EXTRAS_TASKS,
): Promise<void> {
  await sql`insert into run_chunks (run_id, chunk_index)
    select ${runId}::uuid, g from generate_series(${extrasPartIndex(extrasTasks - 1)}::int, ${sampleChunks - 1}::int) g
    where g <> -1`.execute(db);
}

/** Queue entries of a run with `sampleChunks` chunks of samples. */
export const queuedTasks = (sampleChunks: number, extrasTasks = EXTRAS_TASKS): number =>
  sampleChunks + extrasTasks;
