import type { RunResults } from '@sigmatail/engine';
import { specColumnId } from '@sigmatail/engine';
import { useState } from 'react';
import { ChartFrame } from '../charts/ChartFrame.js';
import { Tornado } from '../charts/Tornado.js';
import { formatSig } from '../format/formatSi.js';
import { INPUT_LABELS, metricInfo } from './metricInfo.js';

/** Influence of each part on one metric: the one-at-a-time tornado and rank regression coefficients. */
export function InfluencePanel({ results, runId }: { results: RunResults; runId: string }) {
  const inf = results.influence;
  const metrics = inf ? Object.keys(inf.tornado).filter((m) => m !== 'valid') : [];
  const [metric, setMetric] = useState(results.specs[0] ? specColumnId(results.specs[0]) : 'balanceDb');
  if (!inf) return <p className="text-sm text-dim">This run was launched without the influence analysis.</p>;
  const chosen = metrics.includes(metric) ? metric : metrics[0];
  const info = metricInfo(chosen);
  const bars = (inf.tornado[chosen] ?? []).map((b) => ({
    label: INPUT_LABELS[b.input] ?? b.input,
    low: b.low ?? Number.NaN,
    high: b.high ?? Number.NaN,
  }));
  const srrc = Object.entries(inf.srrc[chosen] ?? {})
    .filter((e): e is [string, number] => e[1] !== null)
    .sort((a, b) => Math.abs(b[1]) - Math.abs(a[1]));
  return (
    <div className="grid gap-3 md:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <ChartFrame
        title={`Influence on ${info.label}`}
        fileName={`run-${runId.slice(0, 8)}-influence-${chosen}`}
        note="Each part moved alone to its tolerance extreme (tubes to ±3σ), everything else nominal."
      >
        {(ref) => (
          <>
            <div className="no-print mb-2">
              <label htmlFor="influence-metric" className="mr-2 text-xs text-dim">
                Metric
              </label>
              <select
                id="influence-metric"
                className="rounded border border-rule bg-white px-2 py-1 text-sm"
                value={chosen}
                onChange={(e) => setMetric(e.target.value)}
              >
                {metrics.map((m) => (
                  <option key={m} value={m}>
                    {metricInfo(m).label}
                  </option>
                ))}
              </select>
            </div>
            <Tornado
              svgRef={ref}
              bars={bars}
              centre={results.nominal?.[chosen] ?? Number.NaN}
              unit={info.unit}
              label={`Influence tornado for ${info.label}`}
            />
          </>
        )}
      </ChartFrame>
      <div className="rounded-lg border border-rule bg-sheet p-3">
        <h3 className="mb-1 text-sm font-medium">Rank regression (SRRC)</h3>
        <p className="mb-2 text-xs text-dim">
          Over the first {inf.rankSamples.toLocaleString('en-US')} samples; the share of {info.label}&apos;s
          variation each part explains, with its sign.
        </p>
        <table className="w-full text-sm">
          <tbody>
            {srrc.map(([input, v]) => (
              <tr key={input} className="border-b border-rule/50">
                <td className="py-0.5">{INPUT_LABELS[input] ?? input}</td>
                <td className="num text-right">{formatSig(v, 2)}</td>
                <td className="w-1/2 pl-2">
                  <div
                    className="h-2 rounded bg-petrol"
                    style={{ width: `${Math.min(100, Math.abs(v) * 100)}%`, opacity: v < 0 ? 0.5 : 1 }}
                  />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
