import { isConnectionError } from '@sigmatail/db';
import type { Piscina } from 'piscina';
import { ChunkQueue, type ClaimedChunk } from '../runs/chunkQueue.js';
import type { Db } from '../runs/runsDb.js';
import { RunWorkStore, type RunWorkContext } from '../runs/runWorkStore.js';
import type { ChunkOutput, ChunkTask, MergeOutput, MergeTask } from './taskHandler.js';
import { errorText, type WorkerLog } from './workerLog.js';

export type ChunkWorkerOptions = {
  db: Db;
  /** The same database, for pool threads that read chunk results while merging. */
  databaseUrl: string;
  pool: Piscina;
  /** Unique per process, e.g. host:pid:random; written on the chunks this worker leases. */
  owner: string;
  threads: number;
  /** How long a lease lasts without a heartbeat; a killed worker's chunks return after this. */
  leaseMs: number;
  /** Fallback polling period when no notification arrives. */
  pollMs: number;
  maxAttempts?: number;
  log?: WorkerLog;
  /** Called after each loop turn (sends pending notifications); errors are logged. */
  housekeeping?: () => Promise<void>;
};

type InFlight = { chunk: ClaimedChunk; abort: AbortController };

/**
 * One worker process's loop: keeps its piscina pool busy with leased chunks, stores each result
 * as it finishes, merges a run when its last chunk lands, heartbeats its leases, and aborts the
 * tasks of runs that were cancelled or failed elsewhere.
 */
export class ChunkWorker {
  private readonly queue: ChunkQueue;
  private readonly store: RunWorkStore;
  private readonly inFlight = new Map<string, InFlight>();
  private readonly contexts = new Map<string, RunWorkContext>();
  private readonly merges = new Set<Promise<void>>();
  private stopped = false;
  private lastSweep = 0;
  private wakeUp: (() => void) | undefined;
  private wakePending = false;
  private heartbeatTimer: NodeJS.Timeout | undefined;
  private loopDone: Promise<void> | undefined;
  private readonly log: WorkerLog;

  constructor(private readonly o: ChunkWorkerOptions) {
    this.queue = new ChunkQueue(o.db, o.owner, o.leaseMs, o.maxAttempts ?? 3);
    this.store = new RunWorkStore(o.db);
    this.log = o.log ?? (() => {});
  }

  start(): void {
    this.heartbeatTimer = setInterval(() => void this.heartbeat(), Math.max(50, this.o.leaseMs / 3));
    this.loopDone = this.loop();
  }

  /** Looks for work now (a run was launched, a chunk finished) instead of at the next poll. */
  wake(): void {
    // Remembered when the loop is busy, so a wake during a claim is not lost until the next poll.
    this.wakePending = true;
    this.wakeUp?.();
  }

  /** A run changed state elsewhere (e.g. cancelled): check at once instead of at the next heartbeat. */
  runChanged(): void {
    void this.heartbeat();
  }

  /** Stops claiming, aborts running tasks and hands their chunks back at once. */
  async stop(): Promise<void> {
    this.stopped = true;
    clearInterval(this.heartbeatTimer);
    this.wake();
    const held = [...this.inFlight.values()];
    for (const f of held) f.abort.abort();
    await Promise.allSettled(held.map((f) => this.queue.release(f.chunk.runId, f.chunk.chunkIndex, false)));
    await this.loopDone;
    await Promise.allSettled([...this.merges]);
  }

  private async loop(): Promise<void> {
    while (!this.stopped) {
      try {
        await this.fill();
        // Sweeps run once per poll period, not on every wake (a wake follows every chunk).
        if (Date.now() - this.lastSweep >= this.o.pollMs) {
          this.lastSweep = Date.now();
          const orphan = await this.queue.claimOrphanMerge();
          if (orphan) this.startMerge(orphan);
          const failed = await this.queue.failExhausted();
          for (const id of failed)
            this.log('warn', 'run failed: a chunk exhausted its attempts', { runId: id });
          await this.o.housekeeping?.();
        }
      } catch (err) {
        this.log('error', 'worker loop failed', { err: errorText(err) });
      }
      if (this.stopped) break;
      if (this.wakePending) {
        this.wakePending = false;
        continue;
      }
      await new Promise<void>((resolve) => {
        const t = setTimeout(resolve, this.o.pollMs);
        this.wakeUp = () => {
          clearTimeout(t);
          resolve();
        };
      });
      this.wakeUp = undefined;
      this.wakePending = false;
    }
  }

  /**
   * Three tasks per thread: one running, two queued, so no thread waits for a database round trip
   * (a midband chunk computes in ~60 ms, about a store and a claim on a busy machine).
   */
  private async fill(): Promise<void> {
    const room = this.o.threads * 3 - this.inFlight.size;
    if (room <= 0) return;
    const claimed = await this.queue.claim(room);
    for (const chunk of claimed) {
      const abort = new AbortController();
      this.inFlight.set(key(chunk), { chunk, abort });
      void this.runOne(chunk, abort.signal);
    }
  }

  private async runOne(chunk: ClaimedChunk, signal: AbortSignal): Promise<void> {
    try {
      let out: ChunkOutput;
      try {
        const ctx = await this.context(chunk.runId);
        const task: ChunkTask = {
          kind: 'chunk',
          runId: chunk.runId,
          design: ctx.design,
          plan: ctx.plan,
          chunkIndex: chunk.chunkIndex,
        };
        out = (await this.o.pool.run(task, { signal })) as ChunkOutput;
      } catch (err) {
        if (isConnectionError(err)) throw err; // the database failed, not the chunk (below)
        if (!signal.aborted && !this.stopped) await this.chunkFailed(chunk, (err as Error).message);
        return;
      }
      if (signal.aborted) return;
      const d = await this.queue.deliver(chunk.runId, chunk.chunkIndex, out);
      if (d.kind === 'stored') this.log('debug', 'chunk stored', { ...where(chunk), done: d.chunksDone });
      if (d.kind === 'stored' && d.mergeNow) this.startMerge(chunk.runId);
    } catch (err) {
      // The database failed us, not the chunk: its lease expires and it is computed again.
      this.log('warn', 'chunk result not stored', { ...where(chunk), err: errorText(err) });
    } finally {
      this.inFlight.delete(key(chunk));
      this.wake();
    }
  }

  /** A chunk that threw is tried again (by any worker) until its attempts run out; then the run fails. */
  private async chunkFailed(chunk: ClaimedChunk, message: string): Promise<void> {
    this.log('warn', 'chunk failed', { ...where(chunk), attempt: chunk.attempts, err: message });
    if (chunk.attempts >= (this.o.maxAttempts ?? 3)) {
      await this.store.fail(chunk.runId, `chunk ${chunk.chunkIndex} failed: ${message}`);
    } else {
      await this.queue.release(chunk.runId, chunk.chunkIndex, true);
    }
  }

  private startMerge(runId: string): void {
    const p = this.merge(runId).finally(() => this.merges.delete(p));
    this.merges.add(p);
  }

  private async merge(runId: string): Promise<void> {
    try {
      const ctx = await this.context(runId);
      const task: MergeTask = {
        kind: 'merge',
        runId,
        design: ctx.design,
        plan: ctx.plan,
        databaseUrl: this.o.databaseUrl,
      };
      const out = (await this.o.pool.run(task)) as MergeOutput;
      const stored = await this.store.storeResults(runId, this.o.owner, out);
      this.log('info', stored ? 'run done' : 'merge discarded', { runId });
    } catch (err) {
      if (this.stopped) return;
      this.log('error', 'merge failed', { runId, err: errorText(err) });
      // A database outage is not the run's fault: leave the merge lease to expire, and this or
      // another worker merges again once the database answers.
      if (isConnectionError(err)) return;
      await this.store.fail(runId, `merge failed: ${(err as Error).message}`).catch(() => false);
    } finally {
      this.contexts.delete(runId);
    }
  }

  private async context(runId: string): Promise<RunWorkContext> {
    let ctx = this.contexts.get(runId);
    if (!ctx) {
      ctx = await this.store.context(runId);
      if (!ctx) throw new Error(`run ${runId} not found`);
      // Runs merged by other workers never tell this one they ended: bound the cache instead.
      if (this.contexts.size >= 64) this.contexts.clear();
      this.contexts.set(runId, ctx);
    }
    return ctx;
  }

  private heartbeating = false;
  /** Renews leases and aborts the tasks of runs that are no longer active (cancelled, failed). */
  private async heartbeat(): Promise<void> {
    if (this.heartbeating || this.stopped) return;
    this.heartbeating = true;
    try {
      const runIds = [...new Set([...this.inFlight.values()].map((f) => f.chunk.runId))];
      const status = await this.queue.heartbeat(runIds);
      for (const runId of runIds) {
        const s = status.get(runId);
        if (s === 'queued' || s === 'running') continue;
        let n = 0;
        for (const f of this.inFlight.values()) {
          if (f.chunk.runId === runId && !f.abort.signal.aborted) {
            f.abort.abort();
            n++;
          }
        }
        this.contexts.delete(runId);
        if (n > 0) this.log('info', `run ${s ?? 'deleted'}: tasks aborted`, { runId, tasks: n });
      }
    } catch (err) {
      this.log('error', 'heartbeat failed', { err: errorText(err) });
    } finally {
      this.heartbeating = false;
    }
  }
}

const key = (c: ClaimedChunk) => `${c.runId}:${c.chunkIndex}`;
const where = (c: ClaimedChunk) => ({ runId: c.runId, chunkIndex: c.chunkIndex });
