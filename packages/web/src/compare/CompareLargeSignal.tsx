import type { RunResults } from '@sigmatail/engine';
import { formatSi } from '../format/formatSi.js';
import { intervalText } from '../results/intervalText.js';
import { LARGE_SIGNAL_FIGURES } from '../results/largeSignalFigures.js';

const f = (v: number | null | undefined, unit: string) => formatSi(v ?? Number.NaN, unit);

/**
 * The per-sample large-signal figures of the compared runs side by side: mean (95 % interval of
 * the mean) over each run's subsample, and the difference of means from run A. A run launched
 * without them reads "not computed".
 */
export function CompareLargeSignal({ results }: { results: RunResults[] }) {
  if (results.every((r) => !r.largeSignal))
    return (
      <p className="text-sm text-dim" data-testid="compare-large-signal-absent">
        Not computed for any of these runs (launch with &ldquo;Large-signal figures per sample&rdquo;).
      </p>
    );
  const ref = results[0].largeSignal;
  const stated = results
    .map((r, i) => {
      const run = String.fromCharCode(65 + i);
      const ls = r.largeSignal;
      return ls ? `${run} first ${ls.subsample} samples at ${f(ls.drive, 'V')} peak` : `${run} not computed`;
    })
    .join('; ');
  return (
    <div className="overflow-x-auto">
      <p className="mb-2 text-xs text-dim">
        Each run at its own stated drive on grid 1: {stated}. Under each mean, the 95 % interval of that mean.
      </p>
      <table
        className="num w-full text-sm"
        aria-label="Large signal comparison"
        data-testid="compare-large-signal"
      >
        <thead>
          <tr className="border-b border-rule text-left font-sans text-xs text-dim">
            <th className="py-1.5 font-medium">Figure (mean, 95 % interval)</th>
            {results.map((_, i) => (
              <th key={i} className="text-right font-medium">
                {String.fromCharCode(65 + i)}
                {i > 0 && ' (Δ vs A)'}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {LARGE_SIGNAL_FIGURES.map((fig) => (
            <tr key={fig.key} className="border-b border-rule/50">
              <th scope="row" className="py-1 text-left font-sans font-normal">
                {fig.label}
              </th>
              {results.map((r, i) => {
                const s = r.largeSignal && fig.get(r.largeSignal);
                if (!s) {
                  return (
                    <td key={i} className="text-right font-sans text-xs text-dim">
                      not computed
                    </td>
                  );
                }
                const base = ref && fig.get(ref)?.mean;
                const diff = i > 0 && s.mean !== null && base != null ? s.mean - base : null;
                return (
                  <td key={i} className="text-right">
                    {f(s.mean, fig.unit)}
                    {diff !== null && (
                      <span className="ml-1 text-xs text-dim">
                        ({diff > 0 ? '+' : ''}
                        {formatSi(diff, fig.unit, 2)})
                      </span>
                    )}
                    <span className="block text-xs text-dim">{intervalText(s.interval, fig.unit)}</span>
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
