import type { RunResults } from '@sigmatail/engine';
import { specColumnId } from '@sigmatail/engine';
import { ChartFrame } from '../charts/ChartFrame.js';
import { Histogram } from '../charts/Histogram.js';
import { metricInfo } from '../results/metricInfo.js';
import { commonEdges, rebinHistogram } from './rebinHistogram.js';

/** Each metric's histograms of all compared runs, re-binned onto shared edges and overlaid. */
export function CompareHistograms({ results, metrics }: { results: RunResults[]; metrics: string[] }) {
  return (
    <div className="grid gap-3 md:grid-cols-2">
      {metrics.map((m) => {
        const hs = results.map((r) => r.metrics[m]?.histogram).filter((h) => h !== undefined);
        if (hs.length !== results.length) return null;
        const edges = commonEdges(hs.map((h) => h.edges));
        const info = metricInfo(m);
        const spec = results[0].specs.find((s) => specColumnId(s) === m);
        return (
          <ChartFrame
            key={m}
            title={`${info.label}${info.unit ? ` (${info.unit})` : ''}`}
            fileName={`compare-${m}`}
          >
            {(ref) => (
              <Histogram
                svgRef={ref}
                label={`Overlaid histograms of ${info.label}`}
                unit={info.unit}
                series={hs.map((h, i) => ({
                  label: `Run ${String.fromCharCode(65 + i)}`,
                  edges,
                  counts: rebinHistogram(h.edges, h.counts, edges),
                }))}
                specMin={spec?.min ?? undefined}
                specMax={spec?.max ?? undefined}
              />
            )}
          </ChartFrame>
        );
      })}
    </div>
  );
}
