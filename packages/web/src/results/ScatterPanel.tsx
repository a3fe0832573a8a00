import type { RunResults } from '@sigmatail/engine';
import { specColumnId } from '@sigmatail/engine';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { runQueries } from '../api/queries/runQueries.js';
import { ChartFrame } from '../charts/ChartFrame.js';
import { Scatter } from '../charts/Scatter.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { INPUT_LABELS, metricInfo } from './metricInfo.js';

/** Rows the scatter plots (the first samples of the run, regenerated from its seed). */
export const SCATTER_ROWS = 2000;

/** Any metric against any part, from the first samples of the run. */
export function ScatterPanel({ results, runId }: { results: RunResults; runId: string }) {
  const samples = useQuery(runQueries.samples(runId, SCATTER_ROWS));
  const [metric, setMetric] = useState(results.specs[0]?.metric ?? 'balanceDb');
  const [part, setPart] = useState('rl2');
  if (samples.isPending) return <Loading label="Reading samples…" />;
  if (samples.isError) return <ErrorNote error={samples.error} onRetry={() => samples.refetch()} />;
  const { columns, rows } = samples.data;
  const inputCols = columns.filter((c) => c in INPUT_LABELS);
  const metricCols = columns.filter((c) => c in results.metrics && c !== 'valid');
  const xi = columns.indexOf(part);
  const yi = columns.indexOf(metric);
  const spec = results.specs.find((s) => specColumnId(s) === metric);
  const info = metricInfo(metric);
  const isOhms = /^r/.test(part);
  return (
    <ChartFrame
      title={`${info.label} against ${INPUT_LABELS[part] ?? part}`}
      fileName={`run-${runId.slice(0, 8)}-scatter-${metric}-${part}`}
      note={`First ${rows.length.toLocaleString('en-US')} samples of the run (regenerated from its seed).`}
    >
      {(ref) => (
        <>
          <div className="no-print mb-2 flex flex-wrap gap-3 text-sm">
            <label className="flex items-center gap-1.5 text-xs text-dim">
              Metric
              <select
                className="rounded border border-rule bg-white px-2 py-1 text-sm text-ink"
                value={metric}
                onChange={(e) => setMetric(e.target.value)}
              >
                {metricCols.map((m) => (
                  <option key={m} value={m}>
                    {metricInfo(m).label}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex items-center gap-1.5 text-xs text-dim">
              Part
              <select
                className="rounded border border-rule bg-white px-2 py-1 text-sm text-ink"
                value={part}
                onChange={(e) => setPart(e.target.value)}
              >
                {inputCols.map((c) => (
                  <option key={c} value={c}>
                    {INPUT_LABELS[c]}
                  </option>
                ))}
              </select>
            </label>
          </div>
          {xi < 0 || yi < 0 ? (
            <p className="text-sm text-dim">That column is not in the export.</p>
          ) : (
            <Scatter
              svgRef={ref}
              xs={rows.map((r) => r[xi])}
              ys={rows.map((r) => r[yi])}
              xLabel={INPUT_LABELS[part] ?? part}
              yLabel={info.label}
              xUnit={isOhms ? 'Ω' : ''}
              yUnit={info.unit}
              specMin={spec?.min ?? undefined}
              specMax={spec?.max ?? undefined}
            />
          )}
        </>
      )}
    </ChartFrame>
  );
}
