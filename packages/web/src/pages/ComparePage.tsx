import { useQueries, useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import { runQueries } from '../api/queries/runQueries.js';
import { CompareHistograms } from '../compare/CompareHistograms.js';
import { CompareLargeSignal } from '../compare/CompareLargeSignal.js';
import { CompareTable } from '../compare/CompareTable.js';
import { ErrorNote, Loading, QueryStatus } from '../components/QueryState.js';
import { PageTitle, Panel } from '../components/ui.js';
import { RunTable } from '../runs/RunTable.js';
import { MAX_PICKED_RUNS, togglePick } from '../runs/togglePick.js';

/** Compare 2–4 finished runs; the picked runs live in the URL (?runs=a,b,c) so the page can be shared. */
export function ComparePage() {
  const [params, setParams] = useSearchParams();
  const ids = (params.get('runs') ?? '').split(',').filter(Boolean).slice(0, MAX_PICKED_RUNS);
  const setIds = (next: string[]) =>
    setParams(next.length ? { runs: next.join(',') } : {}, { replace: true });
  const done = useQuery(runQueries.list({ status: 'done' }));
  const loaded = useQueries({ queries: ids.map((id) => runQueries.results(id)) });
  const ready = ids.length >= 2 && loaded.every((q) => q.isSuccess);
  const data = ready ? loaded.map((q) => q.data!) : [];
  const metrics = ready
    ? [...new Set([...data.flatMap((d) => d.results.specs.map((s) => s.metric)), 'gainDiff', 'balanceDb'])]
    : [];
  return (
    <div className="space-y-4">
      <PageTitle sub="Pick two to four finished runs. The address of this page keeps the selection, so you can share it.">
        Compare runs
      </PageTitle>
      <Panel title={`Runs (${ids.length} of ${MAX_PICKED_RUNS} picked)`}>
        <QueryStatus query={done} />
        {done.data && (
          <RunTable runs={done.data} picked={ids} onPick={(id, on) => setIds(togglePick(ids, id, on))} />
        )}
      </Panel>
      {ids.length < 2 && <p className="text-sm text-dim">Pick at least two runs to compare.</p>}
      {loaded.some((q) => q.isPending) && ids.length >= 2 && <Loading label="Loading results…" />}
      {loaded.map(
        (q, i) => q.isError && <ErrorNote key={ids[i]} error={q.error} onRetry={() => q.refetch()} />,
      )}
      {ready && (
        <>
          <Panel title="Statistics">
            <CompareTable loaded={data} metrics={metrics} />
          </Panel>
          <Panel title="Distributions on common bins">
            <CompareHistograms results={data.map((d) => d.results)} metrics={metrics} />
          </Panel>
          <Panel title="Large signal per sample (subsample estimates)">
            <CompareLargeSignal results={data.map((d) => d.results)} />
          </Panel>
        </>
      )}
    </div>
  );
}
