import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Db } from '../runs/runsDb.js';
import { buildRun } from '../runs/testing/buildRun.js';
import { createTestDb } from '../runs/testing/runsTestDb.js';
import { notifyRuns } from './runsChannel.js';
import { fakeJob, type FakeChunk } from './testing/fakeJob.js';
import { spawnWorker, type SpawnedWorker } from './testing/spawnWorker.js';

// Real worker processes against a real database, killed for real.
const fakeMain = new URL('./testing/fakeWorkerMain.ts', import.meta.url);
let db: Db;
let url: string;
let drop: (() => Promise<void>) | undefined;
const spawned: SpawnedWorker[] = [];

beforeAll(async () => {
  ({ db, url, drop } = await createTestDb('sigmatail_test_workercrash'));
});
afterEach(async () => {
  await Promise.all(spawned.splice(0).map((w) => w.kill('SIGKILL')));
});
afterAll(async () => {
  await drop?.();
});

function startWorker(extra: Record<string, string> = {}): SpawnedWorker {
  const w = spawnWorker(fakeMain, {
    DATABASE_URL: url,
    SIGMATAIL_WORKER_THREADS: '1',
    SIGMATAIL_LEASE_MS: '1500',
    SIGMATAIL_POLL_MS: '100',
    ...extra,
  });
  spawned.push(w);
  return w;
}

async function runRow(runId: string) {
  return db.selectFrom('runs').selectAll().where('id', '=', runId).executeTakeFirstOrThrow();
}

async function waitUntil<T>(probe: () => Promise<T | undefined>, timeoutMs = 30_000): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = await probe();
    if (v !== undefined) return v;
    if (Date.now() - t0 > timeoutMs) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 50));
  }
}

function directResult(samples: number, chunkSize: number, seed: string, spin: number) {
  const plan = { samples, chunkSize, seed, plan: 'random' as const };
  const design = fakeJob.prepare({ spinPerSample: spin });
  const chunks: FakeChunk[] = [];
  for (let k = 0; k < Math.ceil(samples / chunkSize); k++) chunks.push(fakeJob.runChunk(design, plan, k));
  const merger = fakeJob.createMerger(design, plan, fakeJob.runExtras(design, plan));
  chunks.forEach((c) => merger.add(c));
  return merger.finish();
}

describe('worker processes', () => {
  it('finishes a run bit-identically after a worker is killed with SIGKILL mid-run', async () => {
    const spin = 40; // ~30 ms per chunk of 2 000 samples
    const runId = await buildRun(db, {
      samples: 120_000,
      chunkSize: 2_000,
      seed: 'crash',
      design: { spinPerSample: spin },
    });
    const victim = startWorker();
    const survivor = startWorker();
    await Promise.all([victim.waitFor(/started/), survivor.waitFor(/started/)]);
    await notifyRuns(db, 'launched', runId);
    await waitUntil(async () => ((await runRow(runId)).chunks_done >= 10 ? true : undefined));
    await victim.kill('SIGKILL');
    const status = await waitUntil(async () => {
      const r = await runRow(runId);
      return ['done', 'failed'].includes(r.status) ? r.status : undefined;
    });
    expect(status).toBe('done');
    const retried = await db
      .selectFrom('run_chunks')
      .select('chunk_index')
      .where('run_id', '=', runId)
      .where('attempts', '>', 1)
      .execute();
    expect(retried.length).toBeGreaterThan(0); // the victim held leases when it died
    const stored = await db
      .selectFrom('run_results')
      .select('results')
      .where('run_id', '=', runId)
      .executeTakeFirstOrThrow();
    expect(JSON.stringify(stored.results)).toBe(JSON.stringify(directResult(120_000, 2_000, 'crash', spin)));
  });

  it('cancel aborts the running task promptly and marks the run cancelled', async () => {
    // One chunk takes seconds, so only an aborted task can free the thread quickly.
    const runId = await buildRun(db, {
      samples: 20_000,
      chunkSize: 10_000,
      design: { spinPerSample: 20_000 },
    });
    const w = startWorker();
    await w.waitFor(/started/);
    await notifyRuns(db, 'launched', runId);
    await waitUntil(async () => ((await runRow(runId)).status === 'running' ? true : undefined));
    await db.updateTable('runs').set({ status: 'cancelled' }).where('id', '=', runId).execute();
    await notifyRuns(db, 'changed', runId);
    await w.waitFor(
      new RegExp(`"runId":"${runId}".*"tasks":[1-3].*"msg":"run cancelled: tasks aborted"`),
      5_000,
    );
    // The freed thread takes the next run at once.
    const next = await buildRun(db, { samples: 1_000, chunkSize: 1_000 });
    await notifyRuns(db, 'launched', next);
    await waitUntil(async () => ((await runRow(next)).status === 'done' ? true : undefined), 10_000);
    const r = await runRow(runId);
    expect(r.status).toBe('cancelled');
    expect(r.chunks_done).toBe(0);
  });

  it('hands its chunks back on SIGTERM so another worker needs no lease expiry', async () => {
    const runId = await buildRun(db, { samples: 8_000, chunkSize: 2_000, design: { spinPerSample: 5_000 } });
    const first = startWorker({ SIGMATAIL_LEASE_MS: '600000' });
    await first.waitFor(/started/);
    await notifyRuns(db, 'launched', runId);
    await waitUntil(async () => ((await runRow(runId)).status === 'running' ? true : undefined));
    await first.kill('SIGTERM');
    expect(first.output.join('\n')).toMatch(/SIGTERM: stopping/);
    const open = await db
      .selectFrom('run_chunks')
      .select('state')
      .where('run_id', '=', runId)
      .where('state', '=', 'leased')
      .execute();
    expect(open).toEqual([]);
    const second = startWorker({ SIGMATAIL_LEASE_MS: '600000' });
    await second.waitFor(/started/);
    await waitUntil(async () => ((await runRow(runId)).status === 'done' ? true : undefined));
  });
});
