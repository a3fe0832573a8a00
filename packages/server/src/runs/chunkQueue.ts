import { ENGINE_VERSION } from '@sigmatail/engine';
import { sql } from 'kysely';
import type { Db } from './runsDb.js';

/** A chunk leased to one worker. */
export type ClaimedChunk = { runId: string; chunkIndex: number; attempts: number };

/** What happened when a worker delivered a chunk's result. */
export type ChunkDelivery =
  { kind: 'stored'; chunksDone: number; chunkTotal: number; mergeNow: boolean } | { kind: 'ignored' }; // already stored (delivered twice), or the run is no longer active

/**
 * The PostgreSQL queue of run chunks: claim with FOR UPDATE SKIP LOCKED under a lease,
 * deliver idempotently, elect exactly one merger. All timing uses the database clock, so
 * workers on machines with skewed clocks still agree on lease expiry.
 */
export class ChunkQueue {
  constructor(
    private readonly db: Db,
    private readonly owner: string,
    private readonly leaseMs: number,
    private readonly maxAttempts = 3,
    /** Only runs launched with this engine version are taken (a mixed-version fleet never mixes bits). */
    private readonly engineVersion: string = ENGINE_VERSION,
  ) {}

  /**
   * Leases up to `limit` open chunks (pending, or leased with an expired lease). Runs take turns
   * chunk by chunk (lowest chunk index first, then oldest run), so a small run launched during a
   * 1e8-sample one finishes in seconds instead of waiting for it.
   */
  async claim(limit: number): Promise<ClaimedChunk[]> {
    if (limit <= 0) return [];
    const { rows } = await sql<{ run_id: string; chunk_index: number; attempts: number }>`
      with picked as (
        select c.run_id, c.chunk_index
        from run_chunks c join runs r on r.id = c.run_id
        where r.status in ('queued', 'running') and r.engine_version = ${this.engineVersion} and c.state <> 'done'
          and (c.state = 'pending' or c.lease_until < now())
          and c.attempts < ${this.maxAttempts}
        order by c.chunk_index, r.created_at, c.run_id
        limit ${limit}
        for update of c skip locked
      )
      update run_chunks c
      set state = 'leased', lease_owner = ${this.owner},
          lease_until = now() + ${this.leaseMs} * interval '1 millisecond', attempts = c.attempts + 1
      from picked where c.run_id = picked.run_id and c.chunk_index = picked.chunk_index
      returning c.run_id, c.chunk_index, c.attempts`.execute(this.db);
    const runIds = [...new Set(rows.map((r) => r.run_id))];
    if (runIds.length > 0) {
      await this.db
        .updateTable('runs')
        .set({ status: 'running', started_at: sql<Date>`coalesce(started_at, now())` })
        .where('id', 'in', runIds)
        .where('status', '=', 'queued')
        .execute();
    }
    return rows
      .map((r) => ({ runId: r.run_id, chunkIndex: r.chunk_index, attempts: r.attempts }))
      .sort((a, b) => (a.runId === b.runId ? a.chunkIndex - b.chunkIndex : 0));
  }

  /** Extends the leases this worker still holds; returns the active status of the given runs. */
  async heartbeat(runIds: string[]): Promise<Map<string, string>> {
    if (runIds.length > 0) {
      await this.db
        .updateTable('run_chunks')
        .set({ lease_until: sql<Date>`now() + ${this.leaseMs} * interval '1 millisecond'` })
        .where('lease_owner', '=', this.owner)
        .where('state', '=', 'leased')
        .where('run_id', 'in', runIds)
        .execute();
    }
    await this.db
      .updateTable('runs')
      .set({ merge_lease_until: sql<Date>`now() + ${this.leaseMs} * interval '1 millisecond'` })
      .where('merge_owner', '=', this.owner)
      .where('status', '=', 'merging')
      .execute();
    if (runIds.length === 0) return new Map();
    const rows = await this.db
      .selectFrom('runs')
      .select(['id', 'status'])
      .where('id', 'in', runIds)
      .execute();
    return new Map(rows.map((r) => [r.id, r.status]));
  }

  /**
   * Stores a chunk's result (JSON text, or the engine's binary layout) if it is not stored yet
   * and the run is still active; the worker whose delivery completes the run becomes its merger.
   */
  async deliver(runId: string, chunkIndex: number, result: string | Uint8Array): Promise<ChunkDelivery> {
    const bytes =
      typeof result === 'string' ? null : Buffer.from(result.buffer, result.byteOffset, result.byteLength);
    // One statement (one round trip for the worker's main thread, instead of four): the chunk
    // row is stored, then the run row counted; the run row's lock serialises deliveries, and the
    // count is re-read after the wait, so exactly one delivery sees the last chunk land.
    const last = sql<boolean>`r.chunks_done + 1 >= r.chunk_total`;
    const { rows } = await sql<{ chunks_done: number; chunk_total: number; status: string }>`
      with stored as (
        update run_chunks set state = 'done',
          result = ${typeof result === 'string' ? result : null}::json, result_bin = ${bytes}::bytea,
          lease_owner = null, lease_until = null, done_at = now()
        where run_id = ${runId} and chunk_index = ${chunkIndex} and state <> 'done'
          and exists (select 1 from runs where id = ${runId} and status in ('queued', 'running'))
        returning chunk_index)
      update runs r set chunks_done = r.chunks_done + 1,
        status = case when ${last} then 'merging' else 'running' end,
        merge_owner = case when ${last} then ${this.owner} else r.merge_owner end,
        merge_lease_until = case when ${last} then now() + ${this.leaseMs} * interval '1 millisecond'
          else r.merge_lease_until end
      where r.id = ${runId} and r.status in ('queued', 'running') and exists (select 1 from stored)
      returning r.chunks_done, r.chunk_total, r.status`.execute(this.db);
    const run = rows[0];
    if (!run) return { kind: 'ignored' };
    return {
      kind: 'stored',
      chunksDone: run.chunks_done,
      chunkTotal: run.chunk_total,
      mergeNow: run.status === 'merging',
    };
  }

  /**
   * Gives a chunk back at once instead of waiting for its lease to expire: when this worker stops
   * (the attempt does not count) or when the chunk threw (it does, so a bad chunk ends the run).
   */
  async release(runId: string, chunkIndex: number, countAttempt: boolean): Promise<void> {
    await this.db
      .updateTable('run_chunks')
      .set({
        state: 'pending',
        lease_owner: null,
        lease_until: null,
        attempts: countAttempt ? sql<number>`attempts` : sql<number>`greatest(attempts - 1, 0)`,
      })
      .where('run_id', '=', runId)
      .where('chunk_index', '=', chunkIndex)
      .where('lease_owner', '=', this.owner)
      .where('state', '=', 'leased')
      .execute();
  }

  /** Takes over the merge of a run whose merger died (merge lease expired). */
  async claimOrphanMerge(): Promise<string | undefined> {
    const { rows } = await sql<{ id: string }>`
      update runs set merge_owner = ${this.owner},
        merge_lease_until = now() + ${this.leaseMs} * interval '1 millisecond'
      where id = (
        select id from runs where status = 'merging' and merge_lease_until < now()
          and engine_version = ${this.engineVersion}
        order by created_at limit 1 for update skip locked)
      returning id`.execute(this.db);
    return rows[0]?.id;
  }

  /** Marks failed every active run with a chunk that exhausted its attempts (e.g. it kills its worker). */
  async failExhausted(): Promise<string[]> {
    const { rows } = await sql<{ id: string }>`
      update runs r set status = 'failed', finished_at = now(),
        error = 'a chunk failed ' || ${this.maxAttempts} || ' times (its worker stopped while running it)',
        notify_state = case when r.samples > 1000000 then 'pending' else r.notify_state end
      where r.status in ('queued', 'running') and exists (
        select 1 from run_chunks c where c.run_id = r.id and c.state = 'leased'
          and c.lease_until < now() and c.attempts >= ${this.maxAttempts})
      returning r.id`.execute(this.db);
    return rows.map((r) => r.id);
  }
}
