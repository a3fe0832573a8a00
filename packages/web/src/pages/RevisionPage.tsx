import type { Design } from '@sigmatail/engine';
import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { designQueries } from '../api/queries/designQueries.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { SafetyCaution } from '../components/SafetyCaution.js';
import { PageTitle } from '../components/ui.js';
import { DesignForm } from '../design/DesignForm.js';

/** An old revision, read-only, with its nominal results recomputed by today's engine. */
export function RevisionPage() {
  const { id = '', rev = '' } = useParams();
  const revision = useQuery(designQueries.revision(id, Number(rev)));
  if (revision.isPending) return <Loading label="Loading revision…" />;
  if (revision.isError) return <ErrorNote error={revision.error} onRetry={() => revision.refetch()} />;
  const doc = revision.data.document as Design;
  return (
    <div className="space-y-4">
      <PageTitle
        sub={
          <>
            Revision <span className="num">{revision.data.rev}</span>
            {revision.data.message ? ` — ${revision.data.message}` : ''} ·{' '}
            <Link to={`/designs/${id}`} className="text-glow underline">
              back to the latest
            </Link>
          </>
        }
      >
        {doc.name}
      </PageTitle>
      <SafetyCaution compact />
      <DesignForm initial={doc} readOnly />
    </div>
  );
}
