import { chunkCount, mergeChunks, parseDesign, runChunk, runExtras, type RunPlan } from '@sigmatail/engine';
import { sql } from 'kysely';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { TestClient } from '../testing/testClient.js';
import { spawnWorker, type SpawnedWorker } from '../worker/testing/spawnWorker.js';
import type { Db } from './runsDb.js';
import { exampleDesign } from './testing/exampleDesign.js';
import { createTestDb } from './testing/runsTestDb.js';

// The whole system as processes: the API server (main.ts) and two workers (worker/main.ts) on the
// real engine, against one database of this file's own. Processes are killed for real.
const serverMain = new URL('../main.ts', import.meta.url);
const workerMain = new URL('../worker/main.ts', import.meta.url);
const CHUNK = 2_000;
let db: Db;
let url: string;
let drop: (() => Promise<void>) | undefined;
const procs: SpawnedWorker[] = [];

beforeAll(async () => {
  ({ db, url, drop } = await createTestDb('sigmatail_test_runprocesses'));
});
afterEach(async () => {
  await Promise.all(procs.splice(0).map((p) => p.kill('SIGKILL')));
});
afterAll(async () => {
  await drop?.();
});

async function startServer(): Promise<{ proc: SpawnedWorker; baseUrl: string }> {
  const proc = spawnWorker(serverMain, {
    DATABASE_URL: url,
    PORT: '0',
    SMTP_PORT: '9',
    SIGMATAIL_SECRET: 's'.repeat(40),
    SIGMATAIL_CHUNK_SIZE: String(CHUNK),
  });
  procs.push(proc);
  const line = await proc.waitFor(/on http:\/\/127\.0\.0\.1:\d+/);
  return { proc, baseUrl: /http:\/\/127\.0\.0\.1:\d+/.exec(line)![0] };
}

function startWorker(): SpawnedWorker {
  const w = spawnWorker(workerMain, {
    DATABASE_URL: url,
    SIGMATAIL_WORKER_THREADS: '1',
    SIGMATAIL_LEASE_MS: '1500',
    SIGMATAIL_POLL_MS: '200',
    SMTP_PORT: '9',
  });
  procs.push(w);
  return w;
}

async function until<T>(probe: () => Promise<T | undefined>, timeoutMs = 40_000): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = await probe();
    if (v !== undefined) return v;
    if (Date.now() - t0 > timeoutMs) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 25));
  }
}

describe('runs across process crashes', () => {
  it(
    'survives a SIGKILLed worker and a server restart, with results bit-identical to a direct run',
    { timeout: 90_000 },
    async () => {
      const user = await buildUser(db, { role: 'engineer' });
      // Workers first, so the server-side launch finds them listening.
      const victim = startWorker();
      const survivor = startWorker();
      await Promise.all([victim.waitFor(/started/), survivor.waitFor(/started/)]);
      let server = await startServer();
      const client = new TestClient(server.baseUrl);
      expect(
        (await client.post('/api/auth/login', { email: user.email, password: user.password })).status,
      ).toBe(200);
      const design = await client.post('/api/designs', { document: exampleDesign() });
      const body = { designId: design.body.design.id, samples: 60_000, seed: 'crash-7', plan: 'random' };
      const launched = await client.post('/api/runs', body);
      expect(launched.status).toBe(202);
      const id = launched.body.id as string;

      // Kill the victim while it holds a lease, and the server while the run is under way.
      const victimPid = victim.proc.pid!;
      await until(async () => {
        const { rows } = await sql<{ n: number }>`select count(*)::int as n from run_chunks
        where run_id = ${id} and state = 'leased' and lease_owner like ${`%:${victimPid}:%`}`.execute(db);
        return rows[0]!.n > 0 ? true : undefined;
      });
      await victim.kill('SIGKILL');
      await server.proc.kill('SIGKILL');
      const mid = await db
        .selectFrom('runs')
        .select(['status', 'chunks_done', 'chunk_total'])
        .where('id', '=', id)
        .executeTakeFirstOrThrow();
      expect(mid.status).toBe('running');
      expect(mid.chunks_done).toBeLessThan(mid.chunk_total);
      server = await startServer();
      const after = new TestClient(server.baseUrl);
      after.cookie = client.cookie; // the same session, now served by the restarted server
      const run = await until(async () => {
        const res = await after.get(`/api/runs/${id}`);
        return ['done', 'failed', 'cancelled'].includes(res.body.run.status) ? res.body.run : undefined;
      });
      expect(run.status).toBe('done');
      const retried = await db
        .selectFrom('run_chunks')
        .select('chunk_index')
        .where('run_id', '=', id)
        .where('attempts', '>', 1)
        .execute();
      expect(retried.length).toBeGreaterThan(0);

      // Fetch first: the direct run below takes seconds, long enough for the server to close the
      // idle keep-alive connection under the client's next request.
      const stored = await after.get(`/api/runs/${id}/results`);
      const parsed = parseDesign(exampleDesign());
      if (!parsed.ok) throw new Error('example design does not parse');
      const plan: RunPlan = { samples: 60_000, seed: 'crash-7', plan: 'random', chunkSize: CHUNK };
      const chunks = Array.from({ length: chunkCount(plan) }, (_, k) => runChunk(parsed.design, plan, k));
      const direct = JSON.stringify(mergeChunks(parsed.design, plan, chunks, runExtras(parsed.design, plan)));
      expect(
        JSON.stringify(stored.body.results) === direct,
        'results differ from a direct, undisturbed run',
      ).toBe(true);
    },
  );
});
