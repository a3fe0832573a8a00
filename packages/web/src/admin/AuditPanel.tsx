import { useQuery } from '@tanstack/react-query';
import { adminQueries } from '../api/queries/adminQueries.js';
import type { AuditEvent } from '../api/types.js';
import { QueryStatus } from '../components/QueryState.js';
import { Panel } from '../components/ui.js';
import { formatWhen } from '../format/formatWhen.js';
import { Table } from '../components/Table.js';

function actorOf(e: AuditEvent): string {
  return e.user ? `${e.user.name} <${e.user.email}>` : 'system';
}

function hasDetail(d: unknown): boolean {
  return d !== null && d !== undefined && !(typeof d === 'object' && Object.keys(d).length === 0);
}

export function AuditPanel() {
  const audit = useQuery(adminQueries.audit());
  return (
    <Panel title="Audit log">
      <QueryStatus query={audit} />
      {audit.data?.length === 0 && <p className="text-sm text-dim">Nothing recorded yet.</p>}
      {audit.data && audit.data.length > 0 && (
        <Table
          className="w-full text-sm"
          head={
            <>
              <th className="py-2 font-medium">When</th>
              <th className="font-medium">Who</th>
              <th className="font-medium">Action</th>
              <th className="font-medium">Detail</th>
            </>
          }
        >
          {audit.data.map((e) => (
            <tr key={e.id} className="border-b border-rule/60 align-top">
              <td className="num py-1.5 pr-3 text-xs whitespace-nowrap">{formatWhen(e.at)}</td>
              <td className="pr-3">{actorOf(e)}</td>
              <td className="pr-3 font-medium">{e.action}</td>
              <td className="num text-xs break-all text-dim">
                {e.target ?? ''} {hasDetail(e.detail) ? JSON.stringify(e.detail) : ''}
              </td>
            </tr>
          ))}
        </Table>
      )}
    </Panel>
  );
}
