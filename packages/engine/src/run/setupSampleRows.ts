import type { RunPlan } from './runPlan.js';
import type { RunSetup } from './runSetup.js';
import { evaluateChunk } from './runSetupChunk.js';

/**
 * Raw samples of one chunk, regenerated from the seed (for CSV export): columns are 'sample'
 * (absolute index), every kernel input (suffixed 'Factor' where a metric has the same name), then
 * every kernel metric. Rows are produced lazily, one
 * array per row; NaN stays NaN (the exporter decides how to print it).
 *
 * @example for (const row of setupSampleRows(setup, plan, 0).rows) csv.write(row.join(','))
 */
export function setupSampleRows(
  setup: RunSetup,
  plan: RunPlan,
  chunkIndex: number,
): { columns: string[]; rows: Iterable<number[]> } {
  const { columns, start, n } = evaluateChunk(setup, plan, chunkIndex);
  const { kernel } = setup.model;
  const cols = [...columns.inputs, ...columns.out];
  return {
    columns: [
      'sample',
      ...kernel.inputs.map((id) => (kernel.metrics.includes(id) ? `${id}Factor` : id)),
      ...kernel.metrics,
    ],
    rows: {
      *[Symbol.iterator]() {
        for (let s = 0; s < n; s++) yield [start + s, ...cols.map((c) => c[s])];
      },
    },
  };
}
