import type { RunResults } from '@sigmatail/engine';
import { Panel } from '../components/ui.js';
import { formatSi } from '../format/formatSi.js';
import { intervalText } from './intervalText.js';
import { LARGE_SIGNAL_FIGURES } from './largeSignalFigures.js';

const f = (v: number | null | undefined, unit: string) => formatSi(v ?? Number.NaN, unit);

/**
 * The per-sample large-signal figures of a run: each figure's mean with the 95 % interval of that
 * mean, and min–max, over the subsample they were computed on (the quasi-static solve is too
 * slow for every sample). Runs launched without them say so.
 */
export function LargeSignalSpreadPanel({ results }: { results: RunResults }) {
  const ls = results.largeSignal;
  return (
    <Panel title="Large signal per sample (subsample estimate)">
      {!ls ? (
        <p className="text-sm text-dim" data-testid="large-signal-spread-absent">
          Not computed for this run: it was launched without &ldquo;Large-signal figures per sample&rdquo;, or
          its design is one the large-signal model does not cover.
        </p>
      ) : (
        <div className="overflow-x-auto" data-testid="large-signal-spread">
          <p className="mb-2 text-xs text-dim">
            Estimated on the run&apos;s first{' '}
            <strong className="num text-ink" data-testid="large-signal-subsample">
              {ls.subsample}
            </strong>{' '}
            of {results.samples.toLocaleString('en-US')} samples, each at its own parts and tubes. Distortion
            at{' '}
            <strong className="num text-ink" data-testid="large-signal-drive">
              {f(ls.drive, 'V')} peak
            </strong>{' '}
            on grid 1 (half the nominal symmetrical drive limit); swings are peak at each output (output 2 is
            the cathode of a split-load stage). The interval is for the mean of the figure, not for single
            units: min–max shows the spread within the subsample.
          </p>
          <table className="num w-full text-sm" aria-label="Large signal per sample">
            <thead>
              <tr className="border-b border-rule text-left font-sans text-xs text-dim">
                <th className="py-1.5 font-medium">Figure</th>
                <th className="text-right font-medium">Mean</th>
                <th className="text-right font-medium">95 % interval of the mean</th>
                <th className="text-right font-medium">Min</th>
                <th className="text-right font-medium">Max</th>
                <th className="text-right font-medium">Samples</th>
              </tr>
            </thead>
            <tbody>
              {LARGE_SIGNAL_FIGURES.map((fig) => {
                const s = fig.get(ls);
                if (!s) return null;
                return (
                  <tr
                    key={fig.key}
                    className="border-b border-rule/50"
                    data-testid={`large-signal-${fig.key}`}
                  >
                    <th scope="row" className="py-1 text-left font-sans font-normal">
                      {fig.label}
                    </th>
                    <td className="text-right">{f(s.mean, fig.unit)}</td>
                    <td className="text-right text-petrol">{intervalText(s.interval, fig.unit)}</td>
                    <td className="text-right">{f(s.min, fig.unit)}</td>
                    <td className="text-right">{f(s.max, fig.unit)}</td>
                    <td className="text-right text-dim">{s.count}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}
