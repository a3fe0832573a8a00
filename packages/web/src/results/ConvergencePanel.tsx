import type { RunResults } from '@sigmatail/engine';
import { ChartFrame } from '../charts/ChartFrame.js';
import { ConvergencePlot } from '../charts/ConvergencePlot.js';
import { wilsonInterval } from '../stats/wilsonInterval.js';

/** Joint yield as samples accumulate, with its 95 % Wilson band at each checkpoint. */
export function ConvergencePanel({ results, runId }: { results: RunResults; runId: string }) {
  const { n, jointYield } = results.convergence;
  const points = n.map((k, i) => {
    const [lo, hi] = wilsonInterval(Math.round(jointYield[i] * k), k);
    return { n: k, value: jointYield[i], lo, hi };
  });
  return (
    <ChartFrame
      title="Convergence of the joint yield"
      fileName={`run-${runId.slice(0, 8)}-convergence`}
      note="Line: yield over the samples drawn so far; band: its 95 % Wilson interval."
    >
      {(ref) => <ConvergencePlot svgRef={ref} points={points} label="Joint yield against samples drawn" />}
    </ChartFrame>
  );
}
