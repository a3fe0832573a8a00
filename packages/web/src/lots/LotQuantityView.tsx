import type { LotSummary } from '@sigmatail/engine';
import { ChartFrame } from '../charts/ChartFrame.js';
import { LotHistogram, type FittedCurve } from '../charts/LotHistogram.js';
import { Table } from '../components/Table.js';
import { formatSi, formatSig } from '../format/formatSi.js';

const SQRT_2PI = Math.sqrt(2 * Math.PI);

function curveOf(f: LotSummary['fits'][number]): FittedCurve {
  const { mu, sigma } = f;
  if (f.dist === 'normal') {
    return {
      label: 'normal fit',
      density: (x) => Math.exp(-0.5 * ((x - mu) / sigma) ** 2) / (sigma * SQRT_2PI),
    };
  }
  return {
    label: 'lognormal fit',
    density: (x) => (x > 0 ? Math.exp(-0.5 * ((Math.log(x) - mu) / sigma) ** 2) / (x * sigma * SQRT_2PI) : 0),
  };
}

const pct = (p: number) => `${formatSig(p * 100, 3)} %`;

/** One measured quantity of a lot: figures, quantiles, histogram with fits, fit tests and the binned verdict. */
export function LotQuantityView({
  label,
  unit,
  summary: s,
}: {
  label: string;
  unit: string;
  summary: LotSummary;
}) {
  const fmt = (v: number) => formatSi(v, unit, 4);
  return (
    <section aria-label={label} className="space-y-3">
      <h3 className="text-sm font-semibold text-ink">{label}</h3>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-5">
        {[
          ['Count', String(s.count)],
          ['Mean', fmt(s.mean)],
          ['sd', `${fmt(s.sd)} (${formatSig((100 * s.sd) / Math.abs(s.mean || 1), 3)} %)`],
          ['Min', fmt(s.min)],
          ['Max', fmt(s.max)],
        ].map(([k, v]) => (
          <div key={k}>
            <dt className="text-xs text-dim">{k}</dt>
            <dd className="num" data-testid={`lot-${k!.toLowerCase()}`}>
              {v}
            </dd>
          </div>
        ))}
      </dl>
      <Table
        className="w-full text-sm"
        head={s.quantiles.map((q) => (
          <th key={q.p} className="py-1 pr-2 font-normal">
            {pct(q.p)}
          </th>
        ))}
      >
        <tr>
          {s.quantiles.map((q) => (
            <td key={q.p} className="num py-1 pr-2">
              {fmt(q.value)}
            </td>
          ))}
        </tr>
      </Table>
      <div className="grid items-start gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <ChartFrame title={`${label}: histogram and fits`} fileName={`lot-${label.replace(/\W+/g, '-')}`}>
          {(ref) => (
            <LotHistogram
              svgRef={ref}
              lo={s.histogram.lo}
              binWidth={s.histogram.width}
              counts={s.histogram.counts}
              curves={s.fits.map(curveOf)}
              unit={unit}
              label={`Histogram of ${label} with fitted curves`}
            />
          )}
        </ChartFrame>
        <div className="space-y-3">
          {s.fits.length > 0 ? (
            <Table
              className="w-full text-sm"
              head={
                <>
                  <th className="py-1 pr-3">Fit</th>
                  <th className="py-1 pr-3">Location, scale</th>
                  <th className="py-1 pr-3">Anderson–Darling A*²</th>
                  <th className="py-1 pr-3">p-value</th>
                  <th className="py-1 pr-3">KS distance</th>
                  <th className="py-1">Verdict (5 %)</th>
                </>
              }
            >
              {s.fits.map((f) => (
                <tr
                  key={f.dist}
                  className="border-b border-rule/60 last:border-0"
                  data-testid={`fit-${f.dist}`}
                >
                  <td className="py-1 pr-3">{f.dist}</td>
                  <td className="num py-1 pr-3">
                    {f.dist === 'normal'
                      ? `μ ${fmt(f.mu)}, σ ${fmt(f.sigma)}`
                      : `median ${fmt(Math.exp(f.mu))}, σ(ln) ${formatSig(f.sigma, 3)}`}
                  </td>
                  <td className="num py-1 pr-3">{formatSig(f.ad.adjusted, 3)}</td>
                  <td className="num py-1 pr-3">
                    {f.ad.pValue < 0.001 ? '<\u00a00.001' : formatSig(f.ad.pValue, 2)}
                  </td>
                  <td className="num py-1 pr-3">{formatSig(f.ks, 3)}</td>
                  <td className={`py-1 ${f.plausible ? 'text-moss' : 'text-brick'}`}>
                    {f.plausible ? 'fits' : 'rejected'}
                  </td>
                </tr>
              ))}
            </Table>
          ) : (
            <p className="text-sm text-dim">Too few distinct values for a fit test (needs 8).</p>
          )}
          {s.binned && (
            <p
              data-testid="binned-verdict"
              className={`rounded-md p-2 text-sm ${s.binned.looksBinned ? 'bg-brass-soft text-ink' : 'text-dim'}`}
            >
              <strong>{s.binned.looksBinned ? 'Looks binned: ' : 'Not binned: '}</strong>
              {s.binned.reason}
              {s.binned.looksBinned && ` (empty from ${fmt(s.binned.gap.low)} to ${fmt(s.binned.gap.high)}).`}
            </p>
          )}
        </div>
      </div>
    </section>
  );
}
