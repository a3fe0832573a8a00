import type { Piscina } from 'piscina';
import { createChunkPool } from '../worker/chunkPool.js';
import type { CsvSliceTask } from './csvSliceTask.js';
import type { CsvSliceRunner } from './streamSamplesCsv.js';

const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
const csvSliceTaskUrl = new URL(`./csvSliceTask${ext}`, import.meta.url);

/**
 * A small thread pool for CSV exports, started on the first export and idle-stopped, so sample
 * regeneration never blocks the API server's event loop (status polls stay quick meanwhile).
 */
export function createExportPool(threads = 1): { slice: CsvSliceRunner; close: () => Promise<void> } {
  let pool: Piscina | undefined;
  return {
    slice: (task: CsvSliceTask) => {
      pool ??= createChunkPool({ threads, minThreads: 0, taskUrl: csvSliceTaskUrl });
      return pool.run(task) as Promise<string>;
    },
    close: async () => {
      await pool?.destroy();
      pool = undefined;
    },
  };
}
