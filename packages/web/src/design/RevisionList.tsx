import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { designQueries } from '../api/queries/designQueries.js';
import type { RevisionSummary } from '../api/types.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { Panel } from '../components/ui.js';
import { formatWhen } from '../format/formatWhen.js';

function authorOf(r: RevisionSummary): string {
  if (r.authorName) return r.authorName;
  return typeof r.author === 'string' ? r.author : (r.author?.name ?? '');
}

/** Saved revisions of a design, newest first; each opens read-only. */
export function RevisionList({ designId }: { designId: string }) {
  const revs = useQuery(designQueries.revisions(designId));
  return (
    <Panel title="Revision history">
      {revs.isPending && <Loading />}
      {revs.isError && <ErrorNote error={revs.error} onRetry={() => revs.refetch()} />}
      {revs.data && (
        <ol className="max-h-72 divide-y divide-rule/70 overflow-y-auto text-sm" aria-label="Revisions">
          {[...revs.data]
            .sort((a, b) => b.revision - a.revision)
            .map((r) => (
              <li key={r.revision} className="flex items-baseline gap-3 py-1.5">
                <Link
                  to={`/designs/${designId}/revisions/${r.revision}`}
                  className="num font-medium text-glow underline"
                >
                  rev {r.revision}
                </Link>
                <span className="flex-1 truncate">
                  {r.message || <span className="text-dim">no note</span>}
                </span>
                <span className="text-xs text-dim">
                  {authorOf(r)} {formatWhen(r.createdAt)}
                </span>
              </li>
            ))}
        </ol>
      )}
    </Panel>
  );
}
