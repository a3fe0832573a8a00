import crypto from 'node:crypto';
import os from 'node:os';
import { createDb } from '@sigmatail/db';
import type { Db } from '../runs/runsDb.js';
import { ChunkWorker } from './chunkWorker.js';
import { createChunkPool, defaultThreads } from './chunkPool.js';
import { listenRuns } from './runsChannel.js';

export type WorkerProcessOptions = {
  env: NodeJS.ProcessEnv;
  /** Thread file to run (tests pass a fake job's); default: the engine's. */
  taskUrl?: URL;
  housekeeping?: (db: Db) => () => Promise<void>;
};

function positiveInt(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1) {
    process.stderr.write(`${name} must be a positive integer (got "${raw}")\n`);
    process.exit(2);
  }
  return n;
}

/** Runs a worker until SIGTERM/SIGINT, then hands its chunks back and exits. */
export async function runWorkerProcess(o: WorkerProcessOptions): Promise<void> {
  const url = o.env.DATABASE_URL;
  if (!url) {
    process.stderr.write('DATABASE_URL is not set (postgres://user@host:port/db of the shared database)\n');
    process.exit(2);
  }
  const threads = positiveInt(o.env, 'SIGMATAIL_WORKER_THREADS', defaultThreads());
  const leaseMs = positiveInt(o.env, 'SIGMATAIL_LEASE_MS', 30_000);
  const pollMs = positiveInt(o.env, 'SIGMATAIL_POLL_MS', 1_000);
  const owner = `${os.hostname()}:${process.pid}:${crypto.randomBytes(3).toString('hex')}`;
  const log = (line: string) => process.stdout.write(`[worker ${owner}] ${line}\n`);

  const db = createDb(url, { max: 4 });
  const pool = createChunkPool({ threads, taskUrl: o.taskUrl });
  const worker = new ChunkWorker({
    db,
    pool,
    owner,
    threads,
    leaseMs,
    pollMs,
    log,
    housekeeping: o.housekeeping?.(db),
  });
  const channel = listenRuns(
    url,
    (event) => (event === 'launched' ? worker.wake() : worker.runChanged()),
    log,
  );
  worker.start();
  log(`started: ${threads} thread(s), lease ${leaseMs} ms`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: stopping`);
    await worker.stop();
    await channel.close();
    await pool.destroy();
    await db.destroy();
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}
