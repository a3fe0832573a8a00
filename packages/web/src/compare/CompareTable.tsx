import type { RunResults } from '@sigmatail/engine';
import type { RunView } from '../api/types.js';
import { formatPpm, formatSi, formatYield } from '../format/formatSi.js';
import { metricInfo } from '../results/metricInfo.js';
import { twoProportionZTest } from '../stats/twoProportionZTest.js';

interface Loaded {
  run: RunView;
  results: RunResults;
}

const STATS: [string, (r: RunResults, m: string) => number | null | undefined][] = [
  ['mean', (r, m) => r.metrics[m]?.mean],
  ['sd', (r, m) => r.metrics[m]?.sd],
  ['0.135 %', (r, m) => r.metrics[m]?.quantiles['p0.135']],
  ['99.865 %', (r, m) => r.metrics[m]?.quantiles['p99.865']],
];

function signed(text: string, v: number): string {
  return v > 0 ? `+${text}` : text;
}

function formatP(p: number): string {
  if (!Number.isFinite(p)) return '—';
  if (p < 1e-4) return `< 0.0001`;
  return p.toFixed(4);
}

/**
 * Yield of each run against the first (difference and two-proportion z-test), then distribution
 * statistics of each metric with the difference from the first run.
 */
export function CompareTable({ loaded, metrics }: { loaded: Loaded[]; metrics: string[] }) {
  const [ref] = loaded;
  return (
    <div className="space-y-5 overflow-x-auto">
      <table className="num w-full text-sm" aria-label="Yield comparison">
        <thead>
          <tr className="border-b border-rule text-left font-sans text-xs text-dim">
            <th className="py-1.5 font-medium">Run</th>
            <th className="text-right font-medium">N</th>
            <th className="text-right font-medium">Joint yield</th>
            <th className="text-right font-medium">Reject rate</th>
            <th className="text-right font-medium">Δ yield vs A</th>
            <th className="text-right font-medium">z</th>
            <th className="text-right font-medium">p (two-sided)</th>
          </tr>
        </thead>
        <tbody>
          {loaded.map((l, i) => {
            const j = l.results.joint;
            const t =
              i === 0
                ? null
                : twoProportionZTest(j.pass, j.samples, ref.results.joint.pass, ref.results.joint.samples);
            return (
              <tr key={l.run.id} className="border-b border-rule/50">
                <td className="py-1 font-sans">
                  <strong>{String.fromCharCode(65 + i)}</strong> {l.run.designName}{' '}
                  <span className="num text-xs text-dim">
                    rev {l.run.revision} · {l.run.id.slice(0, 8)} · {l.run.plan} · seed {l.run.seed}
                  </span>
                </td>
                <td className="text-right">{j.samples.toLocaleString('en-US')}</td>
                <td className="text-right" data-testid={`compare-yield-${i}`}>
                  {formatYield(j.yield)}
                </td>
                <td className="text-right">{formatPpm(j.ppm)}</td>
                <td className="text-right">{t ? signed(formatSi(t.diff * 100, '%', 3), t.diff) : '—'}</td>
                <td className="text-right">{t ? formatSi(t.z, '', 3) : '—'}</td>
                <td
                  className={`text-right ${t && t.p < 0.05 ? 'font-semibold text-glow' : ''}`}
                  data-testid={i > 0 ? `compare-p-${i}` : undefined}
                >
                  {t ? formatP(t.p) : 'reference'}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="-mt-3 text-xs text-dim">
        Two-proportion z-test (pooled) of each run&apos;s joint yield against run A; p below 0.05 is
        highlighted.
      </p>
      <table className="num w-full text-sm" aria-label="Statistics comparison">
        <thead>
          <tr className="border-b border-rule text-left font-sans text-xs text-dim">
            <th className="py-1.5 font-medium">Metric</th>
            <th className="font-medium">Statistic</th>
            {loaded.map((l, i) => (
              <th key={l.run.id} className="text-right font-medium">
                {String.fromCharCode(65 + i)}
                {i > 0 && ' (Δ vs A)'}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {metrics.flatMap((m) => {
            const info = metricInfo(m);
            return STATS.map(([name, get], k) => (
              <tr key={`${m}-${name}`} className={k === STATS.length - 1 ? 'border-b border-rule' : ''}>
                <td className="py-0.5 font-sans">{k === 0 ? info.label : ''}</td>
                <td className="font-sans text-xs text-dim">{name}</td>
                {loaded.map((l, i) => {
                  const v = get(l.results, m) ?? Number.NaN;
                  const base = get(ref.results, m) ?? Number.NaN;
                  return (
                    <td key={l.run.id} className="text-right">
                      {formatSi(v, info.unit)}
                      {i > 0 && (
                        <span className="ml-1 text-xs text-dim">
                          ({signed(formatSi(v - base, info.unit, 2), v - base)})
                        </span>
                      )}
                    </td>
                  );
                })}
              </tr>
            ));
          })}
        </tbody>
      </table>
    </div>
  );
}
