import { acColumnId, BAND_FREQUENCIES, type RunResults } from '@sigmatail/engine';
import { ChartFrame } from '../charts/ChartFrame.js';
import { FrequencyChart } from '../charts/FrequencyChart.js';

/**
 * Balance against frequency over the run's samples: the median and the 2.5–97.5 % envelope at
 * each band frequency (merged exactly from the chunks' histograms), with the nominal beside.
 * Runs of designs without capacitors (and runs stored before the band existed) have no band.
 */
export function BalanceBandPanel({ results, runId }: { results: RunResults; runId: string }) {
  const freqs = BAND_FREQUENCIES.filter((f) => results.metrics[acColumnId('acBalanceDb', f)]);
  if (freqs.length < 2) return null;
  const q = (f: number, p: 'p2.5' | 'p50' | 'p97.5') =>
    results.metrics[acColumnId('acBalanceDb', f)].quantiles[p] ?? Number.NaN;
  const nominal = freqs.map((f) => results.nominal?.[acColumnId('acBalanceDb', f)] ?? Number.NaN);
  const widest = Math.max(
    ...freqs.map((f) => results.metrics[acColumnId('acBalanceDb', f)].quantileMaxError ?? 0),
  );
  return (
    <ChartFrame
      title="Balance against frequency (all samples)"
      fileName={`run-${runId.slice(0, 8)}-balance-band`}
      note={`Median and 2.5–97.5 % of the samples at ${freqs.length} frequencies; quantiles good to ±${widest.toPrecision(2)} dB (histogram bin).`}
    >
      {(ref) => (
        <div data-testid="balance-band">
          <FrequencyChart
            svgRef={ref}
            label="Balance median and 95 % envelope against frequency"
            frequencies={freqs}
            series={[
              { label: 'median', values: freqs.map((f) => q(f, 'p50')) },
              { label: 'nominal', values: nominal, dashed: true },
            ]}
            band={{
              lo: freqs.map((f) => q(f, 'p2.5')),
              hi: freqs.map((f) => q(f, 'p97.5')),
              label: '2.5–97.5 %',
            }}
            unit="dB"
            width={920}
            height={260}
          />
        </div>
      )}
    </ChartFrame>
  );
}
