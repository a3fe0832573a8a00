import { cpkInterval, specColumnId, type RunResults } from '@sigmatail/engine';
import { formatPpm, formatSig, formatYield } from '../format/formatSi.js';
import { metricInfo } from './metricInfo.js';
import { specLimitsText } from './specLimitsText.js';

type YieldLike = RunResults['joint'];

function Card({
  title,
  children,
  tone = 'plain',
}: {
  title: string;
  children: React.ReactNode;
  tone?: 'plain' | 'good' | 'bad';
}) {
  const ring = tone === 'good' ? 'border-moss/40' : tone === 'bad' ? 'border-brick/40' : 'border-rule';
  return (
    <div className={`print-break rounded-lg border bg-sheet p-3 ${ring}`}>
      <h3 className="text-xs font-medium text-dim">{title}</h3>
      {children}
    </div>
  );
}

function YieldBlock({ y, testId }: { y: YieldLike; testId?: string }) {
  const [lo, hi] = y.wilson;
  const [cpLo, cpHi] = y.clopperPearson;
  return (
    <>
      <p className="num mt-1 text-2xl font-medium text-ink" data-testid={testId}>
        {formatYield(y.yield)}
      </p>
      <p className="num text-xs text-dim">
        95 % Wilson {formatYield(lo)} – {formatYield(hi)}
      </p>
      <p className="num mt-2 text-sm">
        reject {formatPpm(y.ppm)}
        <span className="block text-xs text-dim">
          95 % (exact) {formatPpm((1 - cpHi) * 1e6)} – {formatPpm((1 - cpLo) * 1e6)}
        </span>
      </p>
    </>
  );
}

/** Headline numbers: joint yield and, per spec, yield, reject rate and capability with intervals. */
export function SummaryCards({ results, target }: { results: RunResults; target?: number }) {
  const tone = (y: number) => (target === undefined ? 'plain' : y >= target ? 'good' : 'bad');
  return (
    <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
      <Card
        title={`All specs together · N = ${results.joint.samples.toLocaleString('en-US')}`}
        tone={tone(results.joint.yield)}
      >
        <YieldBlock y={results.joint} testId="joint-yield" />
        {target !== undefined && <p className="mt-1 text-xs text-dim">target {formatYield(target)}</p>}
      </Card>
      {results.specs.map((s, i) => {
        const info = metricInfo(specColumnId(s));
        const ci = cpkInterval(s.cpk, s.samples);
        const limits = specLimitsText(s, info.unit);
        return (
          <Card key={i} title={`${s.label ?? info.label}: ${info.label} ${limits}`} tone={tone(s.yield)}>
            <YieldBlock y={s} />
            <p className="num mt-2 text-sm">
              Cpk {formatSig(s.cpk ?? Number.NaN)}{' '}
              <span className="text-xs text-dim">· Cp {formatSig(s.cp ?? Number.NaN)}</span>
              {ci && (
                <span className="block text-xs text-dim">
                  95 % approx. {formatSig(ci[0])} – {formatSig(ci[1])}
                </span>
              )}
            </p>
          </Card>
        );
      })}
    </div>
  );
}
