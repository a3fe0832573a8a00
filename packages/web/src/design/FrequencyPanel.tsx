import { useMemo } from 'react';
import { nominalFrequencyResponse, type ResolvedDesign } from '@sigmatail/engine';
import { ChartFrame } from '../charts/ChartFrame.js';
import { FrequencyChart } from '../charts/FrequencyChart.js';
import { formatSi } from '../format/formatSi.js';

/**
 * The nominal frequency response, recomputed by the engine in the browser as the design changes:
 * gain of both outputs, balance and phase error against frequency, and the −3 dB points. Output 1
 * is plate 1 (the plate of a split-load), output 2 plate 2 (the cathode of a split-load).
 */
export function FrequencyPanel({
  design,
  metrics,
}: {
  design: ResolvedDesign;
  metrics: Record<string, number>;
}) {
  const r = useMemo(() => nominalFrequencyResponse(design), [design]);
  if (r.status !== 'ok') return null;
  const [name1, name2] = design.topology === 'split-load' ? ['plate', 'cathode'] : ['plate 1', 'plate 2'];
  const corner = (id: string) => (id in metrics ? formatSi(metrics[id], 'Hz') : '—');
  const balanceLimits = design.specs.filter((s) => s.metric === 'acBalanceDb').flatMap((s) => [s.min, s.max]);
  const phaseLimits = design.specs.filter((s) => s.metric === 'acPhaseDeg').flatMap((s) => [s.min, s.max]);
  const defined = (v: (number | undefined)[]) => [...new Set(v.filter((x): x is number => x !== undefined))];
  return (
    <div aria-label="Frequency response" className="space-y-3">
      <h3 className="text-xs font-semibold text-ink">Frequency response (nominal)</h3>
      <p className="num text-xs text-dim" data-testid="corners">
        −3 dB: out 1 {corner('fLow1')} … {corner('fHigh1')} · out 2 {corner('fLow2')} … {corner('fHigh2')}
      </p>
      <ChartFrame title="Gain of each output" fileName="gain-vs-frequency">
        {(ref) => (
          <FrequencyChart
            svgRef={ref}
            label="Gain of output 1 and output 2 against frequency"
            frequencies={r.frequencies}
            series={[
              { label: `out 1 (${name1})`, values: r.gain1Db },
              { label: `out 2 (${name2})`, values: r.gain2Db, dashed: true },
            ]}
            unit="dB"
          />
        )}
      </ChartFrame>
      <ChartFrame title="Balance |out 2| / |out 1|" fileName="balance-vs-frequency">
        {(ref) => (
          <FrequencyChart
            svgRef={ref}
            label="Balance against frequency"
            frequencies={r.frequencies}
            series={[{ label: 'balance (dB)', values: r.balanceDb }]}
            limits={defined(balanceLimits)}
            unit="dB"
          />
        )}
      </ChartFrame>
      <ChartFrame title="Phase error (out 2 against −out 1)" fileName="phase-vs-frequency">
        {(ref) => (
          <FrequencyChart
            svgRef={ref}
            label="Phase error against frequency"
            frequencies={r.frequencies}
            series={[{ label: 'phase error (°)', values: r.phaseDeg }]}
            limits={defined(phaseLimits)}
            unit="°"
          />
        )}
      </ChartFrame>
    </div>
  );
}
