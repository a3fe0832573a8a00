import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router';
import { runQueries } from '../api/queries/runQueries.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { PageTitle, Panel } from '../components/ui.js';
import { RunTable } from '../runs/RunTable.js';

export function RunsPage() {
  const runs = useQuery(runQueries.list());
  const [picked, setPicked] = useState<string[]>([]);
  return (
    <div>
      <PageTitle sub="Every run in the workspace. Runs are reproducible: same design, N, seed and plan give the same numbers.">
        Runs
      </PageTitle>
      <Panel
        actions={
          picked.length >= 2 ? (
            <Link
              to={`/compare?runs=${picked.join(',')}`}
              className="rounded-md bg-glow px-3 py-1.5 text-sm font-medium text-white"
            >
              Compare {picked.length} runs
            </Link>
          ) : (
            <span className="text-xs text-dim">Pick 2–4 runs to compare</span>
          )
        }
      >
        {runs.isPending && <Loading label="Loading runs…" />}
        {runs.isError && <ErrorNote error={runs.error} onRetry={() => runs.refetch()} />}
        {runs.data && (
          <RunTable
            runs={runs.data}
            picked={picked}
            onPick={(id, on) => setPicked((p) => (on ? [...p, id].slice(-4) : p.filter((x) => x !== id)))}
          />
        )}
      </Panel>
    </div>
  );
}
