import { sampleRows, type ResolvedDesign, type RunPlan } from '@sigmatail/engine';

/** One slice of a CSV export: rows [from, from + count) of one chunk, regenerated from the seed. */
export type CsvSliceTask = {
  /** Unique per export request: the thread continues that export's row iterator between slices. */
  exportId: string;
  design: ResolvedDesign;
  plan: RunPlan;
  chunkIndex: number;
  from: number;
  count: number;
  /** Prefix the header line (the first slice of the export). */
  header: boolean;
};

/** CSV text of a number: shortest round-trip form, empty for NaN (no bias point). */
const cell = (x: number): string =>
  Number.isFinite(x) ? String(x) : Number.isNaN(x) ? '' : x > 0 ? 'Infinity' : '-Infinity';

type Cursor = { chunkIndex: number; pos: number; columns: string[]; rows: Iterator<number[]> };
const cursors = new Map<string, Cursor>();
const MAX_CURSORS = 16; // exports abandoned mid-way leave a cursor; the oldest go first

function cursorFor(t: CsvSliceTask): Cursor {
  let c = cursors.get(t.exportId);
  if (!c || c.chunkIndex !== t.chunkIndex || c.pos > t.from) {
    const chunk = sampleRows(t.design, t.plan, t.chunkIndex);
    c = { chunkIndex: t.chunkIndex, pos: 0, columns: chunk.columns, rows: chunk.rows[Symbol.iterator]() };
    cursors.delete(t.exportId);
    cursors.set(t.exportId, c);
    if (cursors.size > MAX_CURSORS) cursors.delete(cursors.keys().next().value!);
  }
  for (; c.pos < t.from; c.pos++) if (c.rows.next().done) break;
  return c;
}

/**
 * Pool-thread entry: CSV text of one slice (empty once the chunk has no more rows), so the API
 * server's event loop only writes text and never regenerates samples itself.
 */
export default function csvSlice(t: CsvSliceTask): string {
  const c = cursorFor(t);
  const lines: string[] = t.header ? [c.columns.join(',')] : [];
  for (let i = 0; i < t.count; i++) {
    const next = c.rows.next();
    if (next.done) break;
    c.pos++;
    lines.push(next.value.map(cell).join(','));
  }
  return lines.length === 0 ? '' : lines.join('\n') + '\n';
}
