import type { RunResults } from '@sigmatail/engine';
import { specColumnId } from '@sigmatail/engine';
import { useState } from 'react';
import { ChartFrame } from '../charts/ChartFrame.js';
import { Histogram } from '../charts/Histogram.js';
import { formatSi } from '../format/formatSi.js';
import { metricInfo, PLOTTABLE } from './metricInfo.js';

/** One histogram per specified metric, plus any others the reader adds. */
export function MetricHistograms({ results, runId }: { results: RunResults; runId: string }) {
  const specMetrics = [...new Set(results.specs.map((s) => specColumnId(s)))];
  // Gain and balance are always worth a look, specified or not.
  const [extra, setExtra] = useState<string[]>(['gainDiff', 'balanceDb']);
  const shown = [...specMetrics, ...extra.filter((m) => !specMetrics.includes(m))];
  const addable = PLOTTABLE.filter((m) => !shown.includes(m) && results.metrics[m]);
  return (
    <div>
      <div className="grid gap-3 md:grid-cols-2">
        {shown.map((m) => {
          const s = results.metrics[m];
          if (!s) return null;
          const info = metricInfo(m);
          const spec = results.specs.find((x) => specColumnId(x) === m);
          const note = (
            <span className="num">
              mean {formatSi(s.mean ?? Number.NaN, info.unit)} · sd {formatSi(s.sd ?? Number.NaN, info.unit)}{' '}
              · 99.73 % in {formatSi(s.quantiles['p0.135'] ?? Number.NaN, info.unit)} …{' '}
              {formatSi(s.quantiles['p99.865'] ?? Number.NaN, info.unit)}
              {s.histogram.underflow + s.histogram.overflow > 0 &&
                ` · ${s.histogram.underflow + s.histogram.overflow} outside the plotted range`}
            </span>
          );
          return (
            <ChartFrame
              key={m}
              title={`${info.label}${info.unit ? ` (${info.unit})` : ''}`}
              fileName={`run-${runId.slice(0, 8)}-${m}`}
              note={note}
            >
              {(ref) => (
                <Histogram
                  svgRef={ref}
                  label={`Histogram of ${info.label}`}
                  unit={info.unit}
                  series={[{ label: info.label, edges: s.histogram.edges, counts: s.histogram.counts }]}
                  specMin={spec?.min ?? undefined}
                  specMax={spec?.max ?? undefined}
                />
              )}
            </ChartFrame>
          );
        })}
      </div>
      {addable.length > 0 && (
        <div className="no-print mt-3 flex items-center gap-2 text-sm">
          <label htmlFor="add-hist" className="text-dim">
            Add a histogram:
          </label>
          <select
            id="add-hist"
            className="rounded border border-rule bg-white px-2 py-1"
            value=""
            onChange={(e) => e.target.value && setExtra((x) => [...x, e.target.value])}
          >
            <option value="">choose a metric…</option>
            {addable.map((m) => (
              <option key={m} value={m}>
                {metricInfo(m).label}
              </option>
            ))}
          </select>
        </div>
      )}
    </div>
  );
}
