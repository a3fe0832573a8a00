import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router';
import { designQueries } from '../api/queries/designQueries.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { QueryStatus } from '../components/QueryState.js';
import { inputClass, PageTitle } from '../components/ui.js';
import { useDebounced } from '../components/useDebounced.js';
import { formatCount, formatSig, formatYield } from '../format/formatSi.js';
import { topologyLabel } from '../format/topologyLabel.js';
import { formatWhen } from '../format/formatWhen.js';

export function DesignsPage() {
  const me = useMe();
  const [q, setQ] = useState('');
  const [archived, setArchived] = useState(false);
  const search = useDebounced(q.trim(), 250);
  const designs = useQuery(designQueries.list(search, archived ? 'include' : 'exclude'));
  const mayEdit = can(me.role, 'editDesign');
  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <PageTitle sub="Stages of the workshop: parts, tubes, spreads and specs.">Designs</PageTitle>
        {mayEdit ? (
          <Link
            to="/designs/new"
            className="mb-5 rounded-md bg-glow px-3 py-2 text-sm font-medium text-white hover:bg-[#8f3b14]"
          >
            New design
          </Link>
        ) : (
          <span className="mb-5 text-sm text-dim">
            Read-only: your role ({me.role}) cannot create designs.
          </span>
        )}
      </div>
      <div className="mb-4 flex flex-wrap items-center gap-4">
        <div className="w-full max-w-sm">
          <label htmlFor="design-search" className="sr-only">
            Search designs
          </label>
          <input
            id="design-search"
            type="search"
            placeholder="Search by name or notes…"
            className={inputClass}
            value={q}
            onChange={(e) => setQ(e.target.value)}
          />
        </div>
        <Link to="/designs/choose" className="text-sm text-petrol underline">
          Choose the splitter
        </Link>
        <label className="flex items-center gap-2 text-sm text-dim">
          <input type="checkbox" checked={archived} onChange={(e) => setArchived(e.target.checked)} />
          Show archived
        </label>
      </div>
      <QueryStatus query={designs} label="Loading designs…" />
      {designs.data && designs.data.length === 0 && (
        <p className="rounded-lg border border-dashed border-rule p-8 text-center text-sm text-dim">
          {search ? `No design matches “${search}”.` : 'No designs yet.'}
        </p>
      )}
      {designs.data && designs.data.length > 0 && (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3" aria-label="Designs">
          {designs.data.map((d) => (
            <li key={d.id}>
              <Link
                to={`/designs/${d.id}`}
                className="block h-full rounded-lg border border-rule bg-sheet p-4 transition-colors hover:border-glow"
              >
                <span className="block font-medium text-ink">{d.name}</span>
                <span className="mt-1 block text-sm text-dim" data-testid="design-glance">
                  {topologyLabel(d.topology)}
                  {d.tube && <> · {d.tube}</>}
                  {d.bPlus != null && (
                    <span className="whitespace-nowrap">
                      {' '}
                      · B+ <span className="num">{formatSig(d.bPlus)}</span> V
                    </span>
                  )}
                </span>
                <span className="mt-1 block text-sm" data-testid="design-latest-run">
                  {d.latestRun && d.latestRun.jointYield != null ? (
                    <>
                      <span className="text-dim">Latest run: </span>
                      <span className="num font-medium text-ink">{formatYield(d.latestRun.jointYield)}</span>
                      <span className="text-dim">
                        {' '}
                        joint yield · <span className="num">{formatCount(d.latestRun.samples)}</span> samples
                        {d.latestRun.revision !== d.latestRev && <> · rev {d.latestRun.revision}</>}
                      </span>
                    </>
                  ) : (
                    <span className="text-dim">No finished run yet</span>
                  )}
                </span>
                <span className="mt-2 flex flex-wrap gap-x-3 text-xs text-dim">
                  <span className="num">rev {d.latestRev}</span>
                  <span>{formatWhen(d.updatedAt)}</span>
                  {d.createdBy && <span>by {d.createdBy.name}</span>}
                  {d.archivedAt && <span className="text-brass">archived</span>}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
