import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { lotQueries } from '../api/lotsApi.js';
import { useMe } from '../auth/useMe.js';
import { QueryStatus } from '../components/QueryState.js';
import { Table } from '../components/Table.js';
import { PageTitle, Panel } from '../components/ui.js';
import { formatWhen } from '../format/formatWhen.js';
import { LotUploadForm } from '../lots/LotUploadForm.js';
import { canManageLots } from '../lots/lotRoles.js';

/** The workspace's measured lots, and the upload form for those who may add one. */
export function LotsPage() {
  const me = useMe();
  const lots = useQuery(lotQueries.list());
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <PageTitle sub="Measured parts and tubes as bought: their spread, whether they fit a normal or lognormal, whether a tighter class was sorted out.">
          Lots
        </PageTitle>
        <Link to="/production/limits" className="mb-5 text-sm text-glow underline">
          Test limits and guard bands →
        </Link>
      </div>
      <Panel title="Lots">
        <QueryStatus query={lots} label="Loading lots…" />
        {lots.data && lots.data.length === 0 && <p className="text-sm text-dim">No lots yet.</p>}
        {lots.data && lots.data.length > 0 && (
          <Table
            className="w-full text-sm"
            head={
              <>
                <th className="py-1.5 pr-3">Name</th>
                <th className="py-1.5 pr-3">Kind</th>
                <th className="py-1.5 pr-3">Count</th>
                <th className="py-1.5 pr-3">Uploaded</th>
                <th className="py-1.5">By</th>
              </>
            }
          >
            {lots.data.map((l) => (
              <tr key={l.id} className="border-b border-rule/60 last:border-0">
                <td className="py-1.5 pr-3">
                  <Link className="text-petrol underline" to={`/production/lots/${l.id}`}>
                    {l.name}
                  </Link>
                </td>
                <td className="py-1.5 pr-3">
                  {l.kind === 'tube' ? `${l.tubeType} tubes (${l.quantity})` : 'resistors'}
                </td>
                <td className="num py-1.5 pr-3">{l.count}</td>
                <td className="py-1.5 pr-3">{formatWhen(l.createdAt)}</td>
                <td className="py-1.5">{l.createdByName}</td>
              </tr>
            ))}
          </Table>
        )}
      </Panel>
      {canManageLots(me.role) ? (
        <Panel title="Upload a lot">
          <LotUploadForm />
        </Panel>
      ) : (
        <p className="text-sm text-dim">Read-only: your role ({me.role}) cannot upload lots.</p>
      )}
    </div>
  );
}
