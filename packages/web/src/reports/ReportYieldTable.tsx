import type { ProductionReport } from '../api/types.js';
import { Table } from '../components/Table.js';
import { formatPpm, formatSig, formatYield } from '../format/formatSi.js';
import { metricInfo } from '../results/metricInfo.js';
import { specLimitsText } from '../results/specLimitsText.js';

type Run = NonNullable<ProductionReport['run']>;

const interval = (r: [number, number] | null, f: (x: number) => string) =>
  r ? `${f(r[0])} – ${f(r[1])}` : '—';

/** Joint and per-spec yield (95 % Wilson), reject rate and Cpk (95 % approx.) of the report's run. */
export function ReportYieldTable({ run }: { run: Run }) {
  return (
    <Table
      className="num w-full text-sm"
      head={
        <>
          <th className="py-1.5 pr-3 font-medium">Spec</th>
          <th className="pr-3 font-medium">Limits</th>
          <th className="pr-3 font-medium">Yield (95 % Wilson)</th>
          <th className="pr-3 font-medium">Reject rate</th>
          <th className="font-medium">Cpk (95 % approx.)</th>
        </>
      }
    >
      <tr className="border-b border-rule/60 font-medium">
        <td className="py-1.5 pr-3">All specs together</td>
        <td className="pr-3">—</td>
        <td className="pr-3" data-testid="report-joint-yield">
          {formatYield(run.joint.yield)} ({interval(run.joint.wilson, formatYield)})
        </td>
        <td className="pr-3">{formatPpm(run.joint.ppm)}</td>
        <td>—</td>
      </tr>
      {run.specs.map((s, i) => {
        const info = metricInfo(s.metric);
        const limits = specLimitsText(s, info.unit);
        return (
          <tr key={i} className="border-b border-rule/40">
            <td className="py-1.5 pr-3">{s.label ?? info.label}</td>
            <td className="pr-3">{limits}</td>
            <td className="pr-3">
              {formatYield(s.yield)} ({interval(s.wilson, formatYield)})
            </td>
            <td className="pr-3">{formatPpm(s.ppm)}</td>
            <td>
              {s.cpk === null ? '—' : formatSig(s.cpk)} ({interval(s.cpkInterval, formatSig)})
            </td>
          </tr>
        );
      })}
    </Table>
  );
}
