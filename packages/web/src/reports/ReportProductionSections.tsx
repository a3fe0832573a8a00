import { Link } from 'react-router';
import type { PpmInterval, ProductionReport } from '../api/types.js';
import { Table } from '../components/Table.js';
import { Panel } from '../components/ui.js';
import { formatPpm, formatSig } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { formatMoney } from '../production/formatMoney.js';

const ppmRange = (x: PpmInterval) => `${formatPpm(x.ppm)} (${formatPpm(x.lowPpm)} – ${formatPpm(x.highPpm)})`;
const limits = (l: { low?: number; high?: number }) =>
  `${l.low === undefined ? '−∞' : formatSig(l.low, 4)} … ${l.high === undefined ? '∞' : formatSig(l.high, 4)}`;

function Missing({ children, to }: { children: string; to: string }) {
  return (
    <p className="text-sm text-dim">
      {children}{' '}
      <Link className="no-print text-petrol underline" to={to}>
        Open
      </Link>
    </p>
  );
}

/** The production lead's choices for the design: plan, pairing, ageing margin, test limits. */
export function ReportProductionSections({ report: r }: { report: ProductionReport }) {
  const { plan, pairing, ageing, limits: tl } = r;
  return (
    <>
      <Panel title="Tolerance plan">
        {!plan ? (
          <Missing to="/production/plans">No tolerance plan saved for this design yet.</Missing>
        ) : !plan.chosen ? (
          <p className="text-sm text-brick">
            The latest plan ({formatWhen(plan.createdAt)}) found no classes that meet{' '}
            {formatPpm(plan.targetPpm)}.
          </p>
        ) : (
          <div className="space-y-2 text-sm" data-testid="report-plan">
            <p>
              Target {formatPpm(plan.targetPpm)}, saved {formatWhen(plan.createdAt)}:{' '}
              {Object.entries(plan.chosen.classes)
                .map(([part, tol]) => `${part.toUpperCase()} ${tol} %`)
                .join(' · ')}{' '}
              · tubes {plan.chosen.tube} · <strong>{formatMoney(plan.chosen.cost, plan.currency)}</strong> per
              unit.
            </p>
            <p className="num">
              Estimate {ppmRange(plan.chosen.estimate)}
              {plan.confirm?.result
                ? ` · confirming run of ${plan.confirm.samples.toLocaleString('en-US')} samples ${ppmRange(plan.confirm.result)}`
                : plan.confirm
                  ? ` · confirming run ${plan.confirm.status}`
                  : ''}
            </p>
          </div>
        )}
      </Panel>
      <Panel title="Pairing">
        {!pairing ? (
          <Missing to="/production/pairing">No pairing comparison saved for this design yet.</Missing>
        ) : (
          <Table
            className="num w-full text-sm"
            head={
              <>
                <th className="py-1.5 pr-3 font-medium">Strategy</th>
                <th className="pr-3 font-medium">Reject rate (95 %)</th>
                <th className="pr-3 font-medium">Cost per good unit</th>
                <th className="font-medium">Tubes thrown away per unit</th>
              </>
            }
          >
            {pairing.strategies.map((s) => (
              <tr key={s.label} className="border-b border-rule/40">
                <td className="py-1.5 pr-3">{s.label}</td>
                <td className="pr-3">{ppmRange(s.reject)}</td>
                <td className="pr-3">{formatMoney(s.costPerGoodUnit, pairing.currency ?? '')}</td>
                <td>{formatSig(s.tubesThrownPerUnit, 3)}</td>
              </tr>
            ))}
          </Table>
        )}
      </Panel>
      <Panel title="Ageing margin">
        {!ageing ? (
          <Missing to="/production/ageing">No ageing result saved for this design yet.</Missing>
        ) : (
          <div className="space-y-2 text-sm">
            <p className="num">
              Reject rate new {ppmRange(ageing.asNew)} · aged {ppmRange(ageing.aged)}
            </p>
            <ul className="num">
              {ageing.specs.map((s) => (
                <li key={s.label} className={s.margin < 0 ? 'text-brick' : ''}>
                  {s.label}: margin {formatSig(s.margin, 3)}
                  {s.marginSd !== null ? ` (${formatSig(s.marginSd, 3)} sd)` : ''}
                </li>
              ))}
            </ul>
          </div>
        )}
      </Panel>
      <Panel title="Test limits">
        {!tl ? (
          <Missing to="/production/limits">No test limits saved for this design yet.</Missing>
        ) : (
          <p className="num text-sm" data-testid="report-limits">
            {tl.metric ?? 'Metric'}: test {limits(tl.test)} against spec {limits(tl.spec)}, measurement sd{' '}
            {formatSig(tl.measurementSd, 3)} → false accept {formatPpm(tl.falseAcceptPpm)}, false reject{' '}
            {formatPpm(tl.falseRejectPpm)}
            {tl.guardBand !== null ? ` · suggested guard band ${formatSig(tl.guardBand, 3)}` : ''}.
          </p>
        )}
      </Panel>
    </>
  );
}
