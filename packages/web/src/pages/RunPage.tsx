import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { workspaceQueries } from '../api/queries/workspaceQueries.js';
import { runQueries } from '../api/queries/runQueries.js';
import { api } from '../api/client.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { SafetyCaution } from '../components/SafetyCaution.js';
import { ResultsView } from '../results/ResultsView.js';
import { RunHeader } from '../runs/RunHeader.js';
import { RunProgress } from '../runs/RunProgress.js';

const linkBtn = 'rounded-md border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-petrol-soft';

export function RunPage() {
  const { id = '' } = useParams();
  const me = useMe();
  const run = useQuery(runQueries.detail(id));
  const done = run.data?.status === 'done';
  const results = useQuery({ ...runQueries.results(id), enabled: done });
  const ws = useQuery(workspaceQueries.detail());
  if (run.isPending) return <Loading label="Loading run…" />;
  if (run.isError) return <ErrorNote error={run.error} onRetry={() => run.refetch()} />;
  const mayExport = can(me.role, 'export');
  return (
    <div className="space-y-4">
      <RunHeader run={run.data} />
      {!done && <RunProgress run={run.data} />}
      {done && (
        <div className="no-print flex flex-wrap gap-2">
          {mayExport ? (
            <>
              <a className={linkBtn} href={api.runs.csvUrl(id)} download>
                Samples CSV
              </a>
              <a className={linkBtn} href={api.runs.jsonUrl(id)} download>
                Results JSON
              </a>
            </>
          ) : (
            <span className="text-sm text-dim">
              Exports are open to production, engineer and admin roles.
            </span>
          )}
          <Link className={linkBtn} to={`/runs/${id}/report`}>
            Printable report
          </Link>
          <Link className={linkBtn} to={`/compare?runs=${id}`}>
            Compare with…
          </Link>
        </div>
      )}
      {done && results.isPending && <Loading label="Loading results…" />}
      {results.isError && <ErrorNote error={results.error} onRetry={() => results.refetch()} />}
      {results.data && (
        <ResultsView
          results={results.data.results}
          runId={id}
          target={ws.data?.settings.defaultYieldTarget}
        />
      )}
      <SafetyCaution />
    </div>
  );
}
