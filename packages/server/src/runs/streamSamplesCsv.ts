import crypto from 'node:crypto';
import type { Writable } from 'node:stream';
import { chunkCount, type ResolvedDesign, type RunPlan } from '@sigmatail/engine';
import type { CsvSliceTask } from './csvSliceTask.js';

/** Rows per slice: big enough to amortise a thread round trip, small enough to keep memory flat. */
const ROWS_PER_SLICE = 2_000;

/** Computes one slice of CSV text (in production: a pool thread; see exportPool). */
export type CsvSliceRunner = (task: CsvSliceTask) => Promise<string>;

/** Resolves on 'drain' or 'close', whichever comes first, and leaves no listener behind. */
function drainOrClose(out: Writable): Promise<void> {
  return new Promise((resolve) => {
    const done = () => {
      out.off('drain', done);
      out.off('close', done);
      resolve();
    };
    out.on('drain', done);
    out.on('close', done);
  });
}

/**
 * Streams every raw sample of a run (inputs and metrics), regenerated from the seed chunk by chunk
 * in slices computed off this thread. Waits for 'drain' whenever the socket's buffer is full, so
 * memory holds about one slice whatever N is. Stops early if the client goes away.
 */
export async function streamSamplesCsv(
  out: Writable,
  design: ResolvedDesign,
  plan: RunPlan,
  slice: CsvSliceRunner,
): Promise<void> {
  let closed = false;
  out.once('close', () => (closed = true));
  const exportId = crypto.randomUUID();
  const total = chunkCount(plan);
  for (let k = 0; k < total && !closed; k++) {
    for (let from = 0; !closed; from += ROWS_PER_SLICE) {
      const header = k === 0 && from === 0;
      const text = await slice({
        exportId,
        design,
        plan,
        chunkIndex: k,
        from,
        count: ROWS_PER_SLICE,
        header,
      });
      if (text === '' || closed) break;
      if (!out.write(text) && !closed) await drainOrClose(out);
      if (text.split('\n').length - (header ? 2 : 1) < ROWS_PER_SLICE) break; // the chunk's last slice
    }
  }
}
