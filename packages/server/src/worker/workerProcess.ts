import crypto from 'node:crypto';
import os from 'node:os';
import { createDb } from '@sigmatail/db';
import { pino } from 'pino';
import { DEFAULT_CONFIG } from '../config.js';
import { createSmtpMailer, type Mailer } from '../mail/mailer.js';
import type { Db } from '../runs/runsDb.js';
import { sendRunNotifications } from '../runs/sendRunNotifications.js';
import { ChunkWorker } from './chunkWorker.js';
import { createChunkPool, defaultThreads } from './chunkPool.js';
import { listenRuns } from './runsChannel.js';
import { errorText, pinoWorkerLog, type WorkerLog } from './workerLog.js';

export type WorkerProcessOptions = {
  env: NodeJS.ProcessEnv;
  /** Thread file to run (tests pass a fake job's); default: the engine's. */
  taskUrl?: URL;
};

/** Mails owners about finished large runs; after an SMTP failure, waits before trying again. */
function notificationHousekeeping(db: Db, mailer: Mailer, appUrl: string, log: WorkerLog) {
  let retryAt = 0;
  return async () => {
    if (Date.now() < retryAt) return;
    try {
      const n = await sendRunNotifications(db, mailer, appUrl);
      if (n > 0) log('info', 'run notifications mailed', { mails: n });
    } catch (err) {
      log('warn', 'run notifications failed; retrying in 30 s', { err: errorText(err) });
      retryAt = Date.now() + 30_000;
    }
  };
}

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
  // One JSON line per event (pino, like the API server), with the worker's owner id on each.
  // Not silenced under vitest as the server's is: crash tests read a spawned worker's lines.
  const logger = pino({ name: 'sigmatail-worker', level: o.env.LOG_LEVEL || 'info' }).child({ owner });
  const log = pinoWorkerLog(logger);

  // Chunks are batch work: below the API server in CPU priority when both share a machine, so
  // page loads stay quick while a long run computes. Set before the pool starts: on Linux each
  // thread has its own nice value and new threads inherit their creator's.
  const nice = Number(o.env.SIGMATAIL_WORKER_NICE ?? 10);
  try {
    if (Number.isInteger(nice) && nice >= 0 && nice <= 19) os.setPriority(nice);
  } catch {
    // not permitted here (e.g. lowered limits): run at normal priority
  }
  const db = createDb(url, { max: 4 });
  const mailer = createSmtpMailer({
    port: positiveInt(o.env, 'SMTP_PORT', 2525),
    from: o.env.SIGMATAIL_MAIL_FROM || DEFAULT_CONFIG.mailFrom,
  });
  const appUrl = o.env.APP_URL || DEFAULT_CONFIG.appUrl;
  const pool = createChunkPool({ threads, taskUrl: o.taskUrl });
  const worker = new ChunkWorker({
    db,
    databaseUrl: url,
    pool,
    owner,
    threads,
    leaseMs,
    pollMs,
    log,
    housekeeping: notificationHousekeeping(db, mailer, appUrl, log),
  });
  const channel = listenRuns(
    url,
    (event) => (event === 'launched' ? worker.wake() : worker.runChanged()),
    (line) => logger.warn(line),
  );
  worker.start();
  log('info', 'started', { threads, leaseMs, nice: os.getPriority() });

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log('info', `${signal}: stopping`);
    await worker.stop();
    await channel.close();
    await pool.destroy();
    mailer.close();
    await db.destroy();
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop('SIGTERM'));
  process.on('SIGINT', () => void stop('SIGINT'));
}
