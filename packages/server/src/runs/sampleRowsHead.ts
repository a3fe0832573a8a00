import { chunkCount, sampleRows, type ResolvedDesign, type RunPlan } from '@sigmatail/engine';

/** The first rows of a run's raw samples, JSON-safe (a non-finite value, e.g. no bias point, is null). */
export type SampleRowsHead = { columns: string[]; rows: (number | null)[][] };

/**
 * The first `limit` samples of a run, regenerated from its seed chunk by chunk (the same rows,
 * bit for bit, as the head of the CSV export); only the chunks needed are computed.
 */
export function sampleRowsHead(design: ResolvedDesign, plan: RunPlan, limit: number): SampleRowsHead {
  let columns: string[] = [];
  const rows: (number | null)[][] = [];
  const total = chunkCount(plan);
  for (let k = 0; k < total && rows.length < limit; k++) {
    const chunk = sampleRows(design, plan, k);
    columns = chunk.columns;
    for (const row of chunk.rows) {
      rows.push(row.map((x) => (Number.isFinite(x) ? x : null)));
      if (rows.length === limit) break;
    }
  }
  return { columns, rows };
}
