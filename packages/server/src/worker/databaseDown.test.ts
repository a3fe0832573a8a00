import { execFile } from 'node:child_process';
import { mkdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { createDb, migrateToLatest } from '@sigmatail/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Db } from '../runs/runsDb.js';
import { buildRun } from '../runs/testing/buildRun.js';
import { exampleDesign } from '../runs/testing/exampleDesign.js';
import { notifyRuns } from './runsChannel.js';
import { spawnWorker, type SpawnedWorker } from './testing/spawnWorker.js';

// Drill: PostgreSQL stops for 10 s in the middle of a run. The worker must live through it,
// reconnect by itself, and the run must end bit-identical to an undisturbed one. The drill has a
// cluster of its own (own port and data directory), so stopping it disturbs no other test.
const run = promisify(execFile);
const pgSh = fileURLToPath(new URL('../../../../scripts/pg.sh', import.meta.url));
const workerMain = new URL('./main.ts', import.meta.url);
const OUTAGE_MS = 10_000;

let env: NodeJS.ProcessEnv;
let root: string;
let db: Db;
let worker: SpawnedWorker | undefined;

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

const pg = async (...args: string[]) => (await run('bash', [pgSh, ...args], { env })).stdout.trim();

async function waitUntil<T>(probe: () => Promise<T | undefined>, timeoutMs: number): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = await probe().catch(() => undefined);
    if (v !== undefined) return v;
    if (Date.now() - t0 > timeoutMs) throw new Error('timed out');
    await new Promise((r) => setTimeout(r, 100));
  }
}

const runRow = (id: string) =>
  db
    .selectFrom('runs')
    .select(['status', 'chunks_done', 'error'])
    .where('id', '=', id)
    .executeTakeFirstOrThrow();

async function finished(id: string, timeoutMs: number) {
  return waitUntil(async () => {
    const r = await runRow(id);
    return ['done', 'failed', 'cancelled'].includes(r.status) ? r : undefined;
  }, timeoutMs);
}

async function storedResults(id: string): Promise<string> {
  const r = await db
    .selectFrom('run_results')
    .select('results')
    .where('run_id', '=', id)
    .executeTakeFirstOrThrow();
  return JSON.stringify(r.results);
}

beforeAll(async () => {
  root = path.join(tmpdir(), `sigmatail-drill-${process.pid}`);
  mkdirSync(root, { recursive: true, mode: 0o755 });
  env = {
    ...process.env,
    SIGMATAIL_PGPORT: String(await freePort()),
    SIGMATAIL_PGDATA: path.join(root, 'pg'),
    SIGMATAIL_DB: 'sigmatail_drill',
    SIGMATAIL_PG_FAST: '1',
  };
  const url = await pg('start');
  db = createDb(url, { max: 4 });
  await migrateToLatest(db);
  worker = spawnWorker(workerMain, {
    DATABASE_URL: url,
    SIGMATAIL_WORKER_THREADS: '1',
    SIGMATAIL_LEASE_MS: '2000',
    SIGMATAIL_POLL_MS: '200',
    SIGMATAIL_WORKER_NICE: '0',
  });
  await worker.waitFor(/started/);
}, 120_000);

afterAll(async () => {
  await worker?.kill('SIGKILL');
  await db?.destroy();
  await pg('stop').catch(() => undefined);
  rmSync(root, { recursive: true, force: true });
});

describe('database down mid-run', () => {
  it('the run completes bit-identical to an undisturbed one and the worker reconnects by itself', async () => {
    const spec = { samples: 1_200_000, chunkSize: 8_192, seed: 'drill', design: exampleDesign() };
    const disturbed = await buildRun(db, spec);
    await notifyRuns(db, 'launched', disturbed);
    await waitUntil(async () => ((await runRow(disturbed)).chunks_done >= 8 ? true : undefined), 60_000);

    await pg('stop');
    const t0 = Date.now();
    await new Promise((r) => setTimeout(r, OUTAGE_MS));
    expect(worker!.proc.exitCode, worker!.output.join('\n')).toBeNull(); // alive through the outage
    await pg('start');
    const outage = Date.now() - t0;

    const back = Date.now();
    const end = await finished(disturbed, 120_000);
    expect(end.error).toBeNull();
    expect(end.status).toBe('done');
    const recovery = Date.now() - back;
    const retried = await db
      .selectFrom('run_chunks')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('run_id', '=', disturbed)
      .where('attempts', '>', 1)
      .executeTakeFirstOrThrow();
    console.log(
      `database-down drill: outage ${outage} ms, run done ${recovery} ms after the restart, ` +
        `${retried.n} chunk(s) leased again`,
    );

    const calm = await buildRun(db, spec);
    await notifyRuns(db, 'launched', calm);
    expect((await finished(calm, 120_000)).status).toBe('done');
    expect(await storedResults(disturbed)).toBe(await storedResults(calm));
    expect(outage).toBeGreaterThanOrEqual(OUTAGE_MS);
    // The worker noticed the outage (it logged failed database calls) and went on.
    expect(worker!.output.join('\n')).toMatch(/ECONNREFUSED|terminat|connection/i);
  }, 300_000);
});
