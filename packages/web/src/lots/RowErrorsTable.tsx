import { Table } from '../components/Table.js';
import type { RowError } from './splitUploadError.js';

/** The problems of a refused lot file: CSV line, column and why. */
export function RowErrorsTable({ rows }: { rows: RowError[] }) {
  return (
    <div className="mt-3 rounded-md border border-brick/40 bg-brick-soft p-3" role="alert">
      <p className="mb-2 text-sm font-medium text-brick">
        Nothing was stored. Fix these rows and upload again:
      </p>
      <Table
        className="w-full text-sm"
        head={
          <>
            <th className="py-1 pr-3">Line</th>
            <th className="py-1 pr-3">Column</th>
            <th className="py-1">Problem</th>
          </>
        }
      >
        {rows.map((r, i) => (
          <tr key={i} className="border-b border-rule/60 last:border-0" data-testid="row-error">
            <td className="num py-1 pr-3">{r.row}</td>
            <td className="py-1 pr-3 font-mono">{r.column || '—'}</td>
            <td className="py-1">{r.message}</td>
          </tr>
        ))}
      </Table>
    </div>
  );
}
