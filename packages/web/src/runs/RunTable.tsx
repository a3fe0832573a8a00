import { Link } from 'react-router';
import type { RunView } from '../api/types.js';
import { formatCount, formatYield } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { RunStatusBadge } from './RunStatusBadge.js';
import { Table } from '../components/Table.js';

/** Runs as rows, with optional tick boxes to pick some for comparison. */
export function RunTable({
  runs,
  picked,
  onPick,
  showDesign = true,
}: {
  runs: RunView[];
  picked?: string[];
  onPick?: (id: string, on: boolean) => void;
  showDesign?: boolean;
}) {
  if (runs.length === 0) return <p className="py-2 text-sm text-dim">No runs yet.</p>;
  return (
    <div className="overflow-x-auto">
      <Table
        className="w-full text-sm"
        head={
          <>
            {onPick && <th className="w-8 font-medium">Pick</th>}
            <th className="py-1.5 font-medium">Run</th>
            {showDesign && <th className="font-medium">Design</th>}
            <th className="font-medium">Status</th>
            <th className="text-right font-medium">N</th>
            <th className="text-right font-medium">Joint yield</th>
            <th className="pl-3 font-medium">Plan</th>
            <th className="font-medium">Seed</th>
            <th className="font-medium">Started</th>
          </>
        }
      >
        {runs.map((r) => (
          <tr key={r.id} className="border-b border-rule/60">
            {onPick && (
              <td>
                <input
                  type="checkbox"
                  aria-label={`Pick run ${r.id.slice(0, 8)} for comparison`}
                  checked={picked?.includes(r.id) ?? false}
                  onChange={(e) => onPick(r.id, e.target.checked)}
                />
              </td>
            )}
            <td className="py-1.5">
              <Link to={`/runs/${r.id}`} className="num text-glow underline">
                {r.id.slice(0, 8)}
              </Link>
            </td>
            {showDesign && (
              <td>
                {r.designName ?? ''}{' '}
                {r.revision !== undefined && <span className="num text-xs text-dim">rev {r.revision}</span>}
              </td>
            )}
            <td>
              <RunStatusBadge status={r.status} />
            </td>
            <td className="num text-right">{formatCount(r.samples)}</td>
            <td className="num text-right">
              {r.summary?.jointYield !== null && r.summary?.jointYield !== undefined
                ? formatYield(r.summary.jointYield)
                : '—'}
            </td>
            <td className="pl-3">{r.plan}</td>
            <td className="num max-w-32 truncate text-xs">{r.seed}</td>
            <td className="text-xs text-dim">{formatWhen(r.createdAt)}</td>
          </tr>
        ))}
      </Table>
    </div>
  );
}
