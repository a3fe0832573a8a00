import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ChunkQueue } from '../runs/chunkQueue.js';
import type { Db } from '../runs/runsDb.js';
import { EXTRAS_TASKS } from '../runs/insertRunChunks.js';
import { buildRun } from '../runs/testing/buildRun.js';
import { createTestDb } from '../runs/testing/runsTestDb.js';
import { ChunkWorker } from './chunkWorker.js';
import { createChunkPool } from './chunkPool.js';
import { fakeJob, type FakeChunk } from './testing/fakeJob.js';

const fakeTask = new URL('./testing/fakeChunkTask.ts', import.meta.url);
let db: Db;
let url: string;
let drop: (() => Promise<void>) | undefined;

beforeAll(async () => {
  ({ db, url, drop } = await createTestDb('sigmatail_test_chunkworker'));
});
afterAll(async () => {
  await drop?.();
});

async function waitForStatus(runId: string, want: string[], timeoutMs = 20_000): Promise<string> {
  const t0 = Date.now();
  for (;;) {
    const r = await db.selectFrom('runs').select('status').where('id', '=', runId).executeTakeFirstOrThrow();
    if (want.includes(r.status)) return r.status;
    if (Date.now() - t0 > timeoutMs) throw new Error(`run ${runId} stuck in ${r.status}`);
    await new Promise((res) => setTimeout(res, 50));
  }
}

/** The job body called directly, without queue or pool: the reference result. */
function directResult(samples: number, chunkSize: number, seed: string) {
  const plan = { samples, chunkSize, seed, plan: 'random' as const };
  const design = fakeJob.prepare({ spinPerSample: 1 });
  const chunks: FakeChunk[] = [];
  for (let k = 0; k < Math.ceil(samples / chunkSize); k++) chunks.push(fakeJob.runChunk(design, plan, k));
  const parts = Array.from({ length: fakeJob.extrasParts }, (_p, i) =>
    fakeJob.runExtrasPart(design, plan, i),
  );
  const merger = fakeJob.createMerger(design, plan, fakeJob.assembleExtras(design, plan, parts));
  chunks.forEach((c) => merger.add(c));
  return merger.finish();
}

describe('ChunkWorker with the fake job', () => {
  it('runs every chunk once, merges once, and matches the job run directly', async () => {
    const runId = await buildRun(db, { samples: 20_000, chunkSize: 700, seed: 'a' });
    const pool = createChunkPool({ threads: 2, taskUrl: fakeTask });
    const workers = ['w1', 'w2'].map(
      (owner) =>
        new ChunkWorker({ db, databaseUrl: url, pool, owner, threads: 1, leaseMs: 5_000, pollMs: 50 }),
    );
    workers.forEach((w) => w.start());
    await waitForStatus(runId, ['done']);
    await Promise.all(workers.map((w) => w.stop()));
    await pool.destroy();
    const run = await db.selectFrom('runs').selectAll().where('id', '=', runId).executeTakeFirstOrThrow();
    expect(run.chunks_done).toBe(29 + EXTRAS_TASKS); // 29 sample chunks and the once-per-run parts
    const stored = await db
      .selectFrom('run_results')
      .selectAll()
      .where('run_id', '=', runId)
      .executeTakeFirstOrThrow();
    expect(stored.results).toEqual(directResult(20_000, 700, 'a'));
    expect(stored.valid_count).toBe(20_000);
  });

  it('still finishes a run queued before the split (the once-per-run work as one task)', async () => {
    const runId = await buildRun(db, { samples: 5_000, chunkSize: 700, seed: 'old', legacyExtras: true });
    const pool = createChunkPool({ threads: 1, taskUrl: fakeTask });
    const worker = new ChunkWorker({
      db,
      databaseUrl: url,
      pool,
      owner: 'w-old',
      threads: 1,
      leaseMs: 5_000,
      pollMs: 50,
    });
    worker.start();
    await waitForStatus(runId, ['done']);
    await worker.stop();
    await pool.destroy();
    const run = await db.selectFrom('runs').selectAll().where('id', '=', runId).executeTakeFirstOrThrow();
    expect([run.chunks_done, run.chunk_total]).toEqual([9, 9]); // 8 sample chunks and the one task
    const stored = await db
      .selectFrom('run_results')
      .selectAll()
      .where('run_id', '=', runId)
      .executeTakeFirstOrThrow();
    expect(stored.results).toEqual(directResult(5_000, 700, 'old'));
  });

  it('ignores a chunk delivered twice and counts it once', async () => {
    const runId = await buildRun(db, { samples: 3_000, chunkSize: 1_000, extrasTasks: 1 });
    const q = new ChunkQueue(db, 'dup', 5_000);
    const claimed = await q.claim(10);
    expect(claimed.map((c) => c.chunkIndex)).toEqual([-2, 0, 1, 2]);
    const first = await q.deliver(runId, 1, '{"x":1}');
    const again = await q.deliver(runId, 1, '{"x":2}');
    expect(first).toEqual({ kind: 'stored', chunksDone: 1, chunkTotal: 4, mergeNow: false });
    expect(again).toEqual({ kind: 'ignored' });
    const row = await db
      .selectFrom('run_chunks')
      .select('result')
      .where('run_id', '=', runId)
      .where('chunk_index', '=', 1)
      .executeTakeFirstOrThrow();
    expect(row.result).toEqual({ x: 1 });
    await q.deliver(runId, 0, '{}');
    await q.deliver(runId, -2, '{}');
    const last = await q.deliver(runId, 2, '{}');
    expect(last).toMatchObject({ kind: 'stored', chunksDone: 4, mergeNow: true });
    expect(await q.deliver(runId, 2, '{}')).toEqual({ kind: 'ignored' });
  });

  it('elects exactly one merger when the last chunks land concurrently', async () => {
    const runId = await buildRun(db, { samples: 40_000, chunkSize: 1_000 });
    const queues = Array.from({ length: 8 }, (_, i) => new ChunkQueue(db, `m${i}`, 5_000));
    const claims = await Promise.all(queues.map((q) => q.claim(6)));
    const deliveries = await Promise.all(
      claims.flatMap((cs, i) => cs.map((c) => queues[i]!.deliver(runId, c.chunkIndex, '{}'))),
    );
    expect(deliveries.filter((d) => d.kind === 'stored' && d.mergeNow)).toHaveLength(1);
    expect(deliveries.every((d) => d.kind === 'stored')).toBe(true);
  });

  it('takes back an expired lease and fails a run whose chunk keeps dying', async () => {
    const runId = await buildRun(db, { samples: 1_000, chunkSize: 1_000, extrasTasks: 1 });
    const dying = new ChunkQueue(db, 'dying', 1, 2); // 1 ms lease: expires at once
    expect(await dying.claim(2)).toHaveLength(2);
    await new Promise((r) => setTimeout(r, 20));
    const again = await dying.claim(2);
    expect(again).toEqual([
      { runId, chunkIndex: -2, attempts: 2 },
      { runId, chunkIndex: 0, attempts: 2 },
    ]);
    await new Promise((r) => setTimeout(r, 20));
    expect(await dying.claim(2)).toEqual([]); // attempts exhausted
    expect(await dying.failExhausted()).toEqual([runId]);
    const run = await db
      .selectFrom('runs')
      .select(['status', 'error'])
      .where('id', '=', runId)
      .executeTakeFirstOrThrow();
    expect(run.status).toBe('failed');
    expect(run.error).toMatch(/failed 2 times/);
  });

  it('retries a chunk that throws, then fails the run naming the chunk and the error', async () => {
    const runId = await buildRun(db, { samples: 5_000, chunkSize: 1_000, design: { failChunk: 3 } });
    const pool = createChunkPool({ threads: 1, taskUrl: fakeTask });
    const lines: string[] = [];
    const worker = new ChunkWorker({
      db,
      databaseUrl: url,
      pool,
      owner: 'thrower',
      threads: 1,
      leaseMs: 5_000,
      pollMs: 50,
      log: (_level, msg, f) => lines.push(`${msg} ${f?.chunkIndex}`),
    });
    worker.start();
    await waitForStatus(runId, ['failed']);
    await worker.stop();
    await pool.destroy();
    const run = await db
      .selectFrom('runs')
      .select(['error', 'finished_at'])
      .where('id', '=', runId)
      .executeTakeFirstOrThrow();
    expect(run.error).toBe('chunk 3 failed: chunk 3 cannot be computed');
    expect(run.finished_at).not.toBeNull();
    expect(lines.filter((l) => l === 'chunk failed 3')).toHaveLength(3);
  });

  it('lets runs take turns, so a small run is not stuck behind a big one', async () => {
    const big = await buildRun(db, { samples: 50_000, chunkSize: 1_000, extrasTasks: 1 });
    const small = await buildRun(db, { samples: 2_000, chunkSize: 1_000, extrasTasks: 1 });
    const q = new ChunkQueue(db, 'turns', 5_000);
    const claimed = await q.claim(6);
    expect(claimed.filter((c) => c.runId === small).map((c) => c.chunkIndex)).toEqual([-2, 0, 1]);
    expect(claimed.filter((c) => c.runId === big).map((c) => c.chunkIndex)).toEqual([-2, 0, 1]);
  });
});
