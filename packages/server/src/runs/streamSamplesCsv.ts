import { once } from 'node:events';
import type { Writable } from 'node:stream';
import { chunkCount, sampleRows, type ResolvedDesign, type RunPlan } from '@sigmatail/engine';

/** Rows per write: big enough to amortise write calls, small enough to keep memory flat. */
const ROWS_PER_WRITE = 500;

/** CSV text of a number: shortest round-trip form, empty for NaN (no bias point). */
const cell = (x: number): string =>
  Number.isFinite(x) ? String(x) : Number.isNaN(x) ? '' : x > 0 ? 'Infinity' : '-Infinity';

/**
 * Streams every raw sample of a run (inputs and metrics), regenerated from the seed chunk by chunk
 * with the engine's sampleRows. Waits for 'drain' whenever the socket's buffer is full, so memory
 * holds one chunk at most whatever N is. Stops early if the client goes away. The regeneration
 * itself (one chunk, ~0.2 s for 65 536 samples) runs on the server's thread.
 */
export async function streamSamplesCsv(out: Writable, design: ResolvedDesign, plan: RunPlan): Promise<void> {
  let closed = false;
  out.once('close', () => (closed = true));
  // Each batch ends with a wait: for 'drain' when the socket buffer is full, else one turn of the
  // event loop, so other requests are served between batches.
  const write = async (text: string) => {
    if (!out.write(text) && !closed) await Promise.race([once(out, 'drain'), once(out, 'close')]);
    else await new Promise((r) => setImmediate(r));
  };
  const total = chunkCount(plan);
  for (let k = 0; k < total && !closed; k++) {
    const { columns, rows } = sampleRows(design, plan, k);
    if (k === 0) await write(columns.join(',') + '\n');
    let batch: string[] = [];
    for (const row of rows) {
      batch.push(row.map(cell).join(','));
      if (batch.length === ROWS_PER_WRITE) {
        await write(batch.join('\n') + '\n');
        batch = [];
        if (closed) return;
      }
    }
    if (batch.length > 0) await write(batch.join('\n') + '\n');
  }
}
