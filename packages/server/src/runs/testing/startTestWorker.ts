import crypto from 'node:crypto';
import type { Db } from '../runsDb.js';
import { ChunkWorker } from '../../worker/chunkWorker.js';
import { createChunkPool } from '../../worker/chunkPool.js';
import { listenRuns } from '../../worker/runsChannel.js';

/** An in-process worker on the engine's thread file (the process entry without signals). */
export function startTestWorker(db: Db, url: string, opts: { threads?: number; taskUrl?: URL } = {}) {
  const threads = opts.threads ?? 2;
  const pool = createChunkPool({ threads, taskUrl: opts.taskUrl });
  const owner = `test:${crypto.randomBytes(3).toString('hex')}`;
  const worker = new ChunkWorker({
    db,
    databaseUrl: url,
    pool,
    owner,
    threads,
    leaseMs: 10_000,
    pollMs: 200,
  });
  const channel = listenRuns(
    url,
    (e) => (e === 'launched' ? worker.wake() : worker.runChanged()),
    () => {},
  );
  worker.start();
  return {
    async stop() {
      await worker.stop();
      await channel.close();
      await pool.destroy();
    },
  };
}
