import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { designQueries } from '../api/queries/designQueries.js';
import { QueryStatus } from '../components/QueryState.js';
import { Panel } from '../components/ui.js';
import { formatWhen } from '../format/formatWhen.js';

/** Saved revisions of a design, newest first; each opens read-only. */
export function RevisionList({ designId }: { designId: string }) {
  const revs = useQuery(designQueries.revisions(designId));
  return (
    <Panel title="Revision history">
      <QueryStatus query={revs} />
      {revs.data && (
        <ol className="max-h-72 divide-y divide-rule/70 overflow-y-auto text-sm" aria-label="Revisions">
          {[...revs.data]
            .sort((a, b) => b.rev - a.rev)
            .map((r) => (
              <li key={r.rev} className="flex items-baseline gap-3 py-1.5">
                <Link
                  to={`/designs/${designId}/revisions/${r.rev}`}
                  className="num font-medium text-glow underline"
                >
                  rev {r.rev}
                </Link>
                <span className="flex-1 truncate">
                  {r.message || <span className="text-dim">no note</span>}
                </span>
                <span className="text-xs text-dim">
                  {r.createdBy.name} · {formatWhen(r.createdAt)}
                </span>
              </li>
            ))}
        </ol>
      )}
    </Panel>
  );
}
