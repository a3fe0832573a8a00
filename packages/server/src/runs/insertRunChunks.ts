import type { Database } from '@sigmatail/db';
import { sql, type Kysely, type Transaction } from 'kysely';
import { EXTRAS_INDEX } from '../worker/runJob.js';

/**
 * Queues a run's work: one row per sample chunk (0..sampleChunks-1) plus the once-per-run task
 * (EXTRAS_INDEX). Returns the queue length, which is the run's chunk_total (progress denominator).
 */
export async function insertRunChunks(
  db: Kysely<Database> | Transaction<Database>,
  runId: string,
  sampleChunks: number,
): Promise<void> {
  await sql`insert into run_chunks (run_id, chunk_index)
    select ${runId}::uuid, g from generate_series(${EXTRAS_INDEX}::int, ${sampleChunks - 1}::int) g`.execute(
    db,
  );
}

/** Queue entries of a run with `sampleChunks` chunks of samples. */
export const queuedTasks = (sampleChunks: number): number => sampleChunks + 1;
