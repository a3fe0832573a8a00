import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router';
import { workspaceQueries } from '../api/queries/workspaceQueries.js';
import { runQueries } from '../api/queries/runQueries.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { SafetyCaution } from '../components/SafetyCaution.js';
import { Button } from '../components/ui.js';
import { formatWhen } from '../format/formatWhen.js';
import { ResultsView } from '../results/ResultsView.js';
import { RunHeader } from '../runs/RunHeader.js';

/** A run's results laid out for paper (print CSS hides navigation and buttons), with the caution. */
export function ReportPage() {
  const { id = '' } = useParams();
  const run = useQuery(runQueries.detail(id));
  const results = useQuery({ ...runQueries.results(id), enabled: run.data?.status === 'done' });
  const ws = useQuery(workspaceQueries.detail());
  if (run.isPending || (run.data?.status === 'done' && results.isPending))
    return <Loading label="Preparing the report…" />;
  if (run.isError) return <ErrorNote error={run.error} />;
  if (run.data.status !== 'done')
    return <ErrorNote error={new Error(`The run is ${run.data.status}; a report exists once it is done.`)} />;
  if (results.isError) return <ErrorNote error={results.error} />;
  return (
    <article className="mx-auto max-w-5xl space-y-4 bg-white p-6 print:max-w-none print:p-0">
      <div className="no-print flex justify-end">
        <Button tone="primary" onClick={() => window.print()}>
          Print or save as PDF
        </Button>
      </div>
      <p className="text-xs tracking-wide text-dim uppercase">
        Sigmatail run report · {ws.data?.name ?? ''} · printed {formatWhen(new Date())}
      </p>
      <RunHeader run={run.data} />
      <SafetyCaution />
      {results.data && (
        <ResultsView
          results={results.data.results}
          runId={id}
          target={ws.data?.settings.defaultYieldTarget}
          printable
        />
      )}
      <SafetyCaution />
    </article>
  );
}
