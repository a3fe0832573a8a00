import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router';
import { runQueries } from '../api/queries/runQueries.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { Panel } from '../components/ui.js';
import { RunTable } from './RunTable.js';

/** Runs of one design, with a shortcut to compare the picked ones. */
export function DesignRunsPanel({ designId }: { designId: string }) {
  const runs = useQuery(runQueries.list({ designId }));
  const [picked, setPicked] = useState<string[]>([]);
  return (
    <Panel
      title="Runs of this design"
      actions={
        picked.length >= 2 && picked.length <= 4 ? (
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
      {runs.isPending && <Loading />}
      {runs.isError && <ErrorNote error={runs.error} onRetry={() => runs.refetch()} />}
      {runs.data && (
        <RunTable
          runs={runs.data}
          showDesign={false}
          picked={picked}
          onPick={(id, on) => setPicked((p) => (on ? [...p, id].slice(-4) : p.filter((x) => x !== id)))}
        />
      )}
    </Panel>
  );
}
