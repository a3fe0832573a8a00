import os from 'node:os';
import { Piscina } from 'piscina';

const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
/** The engine's thread file, beside this module (.ts under tsx/vitest, .js after a build). */
export const chunkTaskUrl = new URL(`./chunkTask${ext}`, import.meta.url);

/** Default pool size: one thread per core of this machine. */
export function defaultThreads(): number {
  return typeof os.availableParallelism === 'function' ? os.availableParallelism() : os.cpus().length;
}

/** A piscina pool of chunk threads. Threads get the tsx loader only when running from source. */
export function createChunkPool(opts: { threads: number; minThreads?: number; taskUrl?: URL }): Piscina {
  const taskUrl = opts.taskUrl ?? chunkTaskUrl;
  const fromSource = taskUrl.pathname.endsWith('.ts');
  const hasTsx = process.execArgv.some((a) => a.includes('tsx'));
  return new Piscina({
    filename: taskUrl.href,
    minThreads: opts.minThreads ?? opts.threads,
    maxThreads: opts.threads,
    // A queued task must not wait behind a thread's own backlog: one task per thread at a time.
    concurrentTasksPerWorker: 1,
    idleTimeout: 60_000,
    execArgv:
      fromSource && !hasTsx
        ? [...process.execArgv, '--conditions=@sigmatail/source', '--import', 'tsx']
        : process.execArgv,
  });
}
