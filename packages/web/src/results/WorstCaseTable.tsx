import type { RunResults } from '@sigmatail/engine';
import { specColumnId } from '@sigmatail/engine';
import { formatSi } from '../format/formatSi.js';
import { metricInfo } from './metricInfo.js';

const KEY_METRICS = [
  'gainDiff',
  'balanceDb',
  'a11',
  'a12',
  'zout1',
  'zout2',
  'ia1',
  'ia2',
  'va1',
  'va2',
  'pd1',
  'pd2',
  'vhk',
];

/** Corner worst case and root-sum-square against the Monte Carlo spread of the same run. */
export function WorstCaseTable({ results }: { results: RunResults }) {
  const wc = results.worstCase;
  if (!wc) return <p className="text-sm text-dim">This run was launched without the worst-case analysis.</p>;
  const ids = [...new Set([...results.specs.map((s) => specColumnId(s)), ...KEY_METRICS])].filter(
    (m) => wc.metrics[m],
  );
  const f = (v: number | null | undefined, unit: string) => formatSi(v ?? Number.NaN, unit);
  return (
    <div className="overflow-x-auto">
      <p className="mb-2 text-xs text-dim">
        {wc.method === 'corners'
          ? `All ${(2 ** wc.inputs.length).toLocaleString('en-US')} corners of ${wc.inputs.length} varied inputs (${wc.evaluations.toLocaleString('en-US')} evaluations)`
          : 'Corner search (too many inputs for all corners)'}
        ; Monte Carlo columns from this run. Worst case is usually far wider than what production sees.
      </p>
      <table className="num w-full text-sm">
        <thead>
          <tr className="border-b border-rule text-left font-sans text-xs text-dim">
            <th className="py-1.5 font-medium">Metric</th>
            <th className="text-right font-medium">Worst-case min</th>
            <th className="text-right font-medium">RSS low</th>
            <th className="text-right font-medium">MC 0.135 %</th>
            <th className="text-right font-medium">MC 99.865 %</th>
            <th className="text-right font-medium">RSS high</th>
            <th className="text-right font-medium">Worst-case max</th>
          </tr>
        </thead>
        <tbody>
          {ids.map((m) => {
            const w = wc.metrics[m];
            const info = metricInfo(m);
            const q = results.metrics[m]?.quantiles;
            return (
              <tr key={m} className="border-b border-rule/50">
                <th scope="row" className="py-1 text-left font-sans font-normal">
                  {info.label}
                </th>
                <td className="text-right">{f(w.min, info.unit)}</td>
                <td className="text-right">{f(w.rss.low, info.unit)}</td>
                <td className="text-right text-petrol">
                  {f(w.monteCarlo?.p0135 ?? q?.['p0.135'], info.unit)}
                </td>
                <td className="text-right text-petrol">
                  {f(w.monteCarlo?.p99865 ?? q?.['p99.865'], info.unit)}
                </td>
                <td className="text-right">{f(w.rss.high, info.unit)}</td>
                <td className="text-right">{f(w.max, info.unit)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
