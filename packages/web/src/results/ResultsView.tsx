import type { RunResults } from '@sigmatail/engine';
import { Panel } from '../components/ui.js';
import { BalanceBandPanel } from './BalanceBandPanel.js';
import { ConvergencePanel } from './ConvergencePanel.js';
import { InfluencePanel } from './InfluencePanel.js';
import { LargeSignalSpreadPanel } from './LargeSignalSpreadPanel.js';
import { MetricHistograms } from './MetricHistograms.js';
import { ScatterPanel } from './ScatterPanel.js';
import { SummaryCards } from './SummaryCards.js';
import { WorstCaseTable } from './WorstCaseTable.js';

/** Everything a finished run reports, in reading order. `printable` leaves out the interactive scatter. */
export function ResultsView({
  results,
  runId,
  target,
  printable = false,
}: {
  results: RunResults;
  runId: string;
  target?: number;
  printable?: boolean;
}) {
  return (
    <div className="space-y-4">
      <SummaryCards results={results} target={target} />
      {results.validCount < results.samples && (
        <p className="rounded-md bg-brass-soft px-3 py-2 text-sm">
          {(results.samples - results.validCount).toLocaleString('en-US')} samples had no bias point and count
          as rejects.
        </p>
      )}
      <Panel title="Distributions">
        <MetricHistograms results={results} runId={runId} />
      </Panel>
      <BalanceBandPanel results={results} runId={runId} />
      <Panel title="Influence">
        <InfluencePanel results={results} runId={runId} />
      </Panel>
      <div className="grid gap-4 lg:grid-cols-2">
        {!printable && (
          <Panel title="Scatter">
            <ScatterPanel results={results} runId={runId} />
          </Panel>
        )}
        <Panel title="Convergence">
          <ConvergencePanel results={results} runId={runId} />
        </Panel>
      </div>
      <Panel title="Worst case against Monte Carlo">
        <WorstCaseTable results={results} />
      </Panel>
      {/* A printed report leaves out the "not computed" note. */}
      {(results.largeSignal || !printable) && <LargeSignalSpreadPanel results={results} />}
    </div>
  );
}
