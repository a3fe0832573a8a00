import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { reportQueries } from '../api/queries/reportQueries.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { SafetyCaution } from '../components/SafetyCaution.js';
import { Button, Panel } from '../components/ui.js';
import { formatCount } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { ReportEmailForm } from '../reports/ReportEmailForm.js';
import { ReportProductionSections } from '../reports/ReportProductionSections.js';
import { ReportYieldTable } from '../reports/ReportYieldTable.js';

/** The production report of one design, laid out for A4/Letter paper, with the high-voltage caution. */
export function ProductionReportPage() {
  const { designId = '' } = useParams();
  const me = useMe();
  const report = useQuery(reportQueries.detail(designId));
  if (report.isPending) return <Loading label="Gathering the report…" />;
  if (report.isError) return <ErrorNote error={report.error} onRetry={() => report.refetch()} />;
  const r = report.data;
  return (
    <article className="mx-auto max-w-5xl space-y-4 bg-white p-6 print:max-w-none print:p-0">
      <div className="no-print flex justify-end gap-2">
        <Button tone="primary" onClick={() => window.print()}>
          Print or save as PDF
        </Button>
      </div>
      <header>
        <p className="text-xs tracking-wide text-dim uppercase">
          Sigmatail production report · {r.workspace.name} · printed {formatWhen(new Date())}
        </p>
        <h1 className="mt-1 text-2xl font-semibold tracking-tight text-ink">{r.design.name}</h1>
        <p className="text-sm text-dim">
          Revision {r.design.revision} · {r.design.topology} · {r.design.tube}
        </p>
      </header>
      <SafetyCaution />
      {r.warnings.length > 0 && (
        <Panel title="Ratings exceeded at nominal">
          <ul className="list-disc pl-5 text-sm text-brick">
            {r.warnings.map((w) => (
              <li key={w.code + w.message}>{w.message}</li>
            ))}
          </ul>
        </Panel>
      )}
      <Panel title="Yield, reject rate and capability">
        {r.run ? (
          <>
            <p className="mb-2 text-sm text-dim">
              From the run of{' '}
              <Link className="text-petrol underline" to={`/runs/${r.run.id}`}>
                {formatCount(r.run.samples)} samples
              </Link>{' '}
              ({r.run.plan}, seed {r.run.seed}) of revision {r.run.revision}, finished{' '}
              {formatWhen(r.run.finishedAt)}.
              {r.run.revision !== r.design.revision && ' The design has changed since: launch a new run.'}
            </p>
            <ReportYieldTable run={r.run} />
          </>
        ) : (
          <p className="text-sm text-dim">
            No finished run of this design yet. Launch one from the{' '}
            <Link className="text-petrol underline" to={`/designs/${r.design.id}`}>
              design page
            </Link>
            .
          </p>
        )}
      </Panel>
      <ReportProductionSections report={r} />
      {can(me.role, 'export') && <ReportEmailForm designId={r.design.id} />}
      <SafetyCaution />
    </article>
  );
}
