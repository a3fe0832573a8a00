import { sql } from 'kysely';
import type { JobPlan } from '../worker/runJob.js';
import type { Db } from './runsDb.js';

/** What a worker needs to compute any chunk of a run. */
export type RunWorkContext = { runId: string; design: unknown; plan: JobPlan };

const MAIL_THRESHOLD = 1_000_000; // runs larger than this mail their owner when they end

/** Reads, stores and fails runs on behalf of workers (the Kysely side of the worker loop). */
export class RunWorkStore {
  constructor(private readonly db: Db) {}

  async context(runId: string): Promise<RunWorkContext | undefined> {
    const r = await this.db
      .selectFrom('runs')
      .select(['id', 'design', 'samples', 'seed', 'plan', 'chunk_size', 'analyses'])
      .where('id', '=', runId)
      .executeTakeFirst();
    if (!r) return undefined;
    return {
      runId: r.id,
      design: r.design,
      plan: { samples: r.samples, seed: r.seed, plan: r.plan, chunkSize: r.chunk_size, analyses: r.analyses },
    };
  }

  /**
   * Stores the merged results and marks the run done, in one transaction, only while this
   * worker still owns the merge (a cancel or a takeover in between makes it a no-op).
   */
  async storeResults(
    runId: string,
    owner: string,
    out: { json: string; validCount: number | null; jointYield: number | null },
  ): Promise<boolean> {
    return this.db.transaction().execute(async (trx) => {
      const run = await trx
        .updateTable('runs')
        .set({
          status: 'done',
          finished_at: sql<Date>`now()`,
          merge_owner: null,
          merge_lease_until: null,
          notify_state: sql`case when samples > ${MAIL_THRESHOLD} then 'pending' else notify_state end`,
        })
        .where('id', '=', runId)
        .where('status', '=', 'merging')
        .where('merge_owner', '=', owner)
        .returning('id')
        .executeTakeFirst();
      if (!run) return false;
      await trx
        .insertInto('run_results')
        .values({
          run_id: runId,
          results: out.json,
          valid_count: out.validCount,
          joint_yield: out.jointYield,
        })
        .onConflict((oc) => oc.column('run_id').doNothing())
        .execute();
      // Merged: the chunk results (~100 kB each, 1 500 of them at 1e8 samples) are not needed again.
      await trx
        .updateTable('run_chunks')
        .set({ result: null, result_bin: null })
        .where('run_id', '=', runId)
        .execute();
      return true;
    });
  }

  /** Ends an active run as failed with a message for its owner. */
  async fail(runId: string, message: string): Promise<boolean> {
    const r = await this.db
      .updateTable('runs')
      .set({
        status: 'failed',
        error: message.slice(0, 2000),
        finished_at: sql<Date>`now()`,
        notify_state: sql`case when samples > ${MAIL_THRESHOLD} then 'pending' else notify_state end`,
      })
      .where('id', '=', runId)
      .where('status', 'in', ['queued', 'running', 'merging'])
      .returning('id')
      .executeTakeFirst();
    return r !== undefined;
  }
}
