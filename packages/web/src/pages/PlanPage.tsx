import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router';
import { productionQueries } from '../api/queries/productionQueries.js';
import { ChartFrame } from '../charts/ChartFrame.js';
import { FrontierChart } from '../charts/FrontierChart.js';
import { QueryStatus } from '../components/QueryState.js';
import { SafetyCaution } from '../components/SafetyCaution.js';
import { Table } from '../components/Table.js';
import { PageTitle, Panel } from '../components/ui.js';
import { formatCount, formatPpm, formatYield } from '../format/formatSi.js';
import { formatMoney } from '../production/formatMoney.js';
import { KIND_LABELS } from '../production/kindLabels.js';
import type { SavedPlan } from '../api/productionTypes.js';

/** One saved plan: the chosen classes with cost, estimate beside the confirming run, the frontier. */
export function PlanPage() {
  const { id } = useParams();
  const plan = useQuery(productionQueries.plan(id!));
  return (
    <div className="space-y-5">
      <QueryStatus query={plan} label="Loading plan…" />
      {plan.data && <PlanView plan={plan.data} />}
    </div>
  );
}

function PlanView({ plan }: { plan: SavedPlan }) {
  const r = plan.result;
  const chosen = r.chosen;
  const c = plan.confirm;
  const conf = `${Math.round(r.confidence * 1000) / 10} %`;
  return (
    <>
      <PageTitle
        sub={
          <>
            <Link to={`/designs/${plan.designId}`} className="text-petrol hover:underline">
              {plan.designName}
            </Link>{' '}
            rev {plan.revision} · target {formatPpm(r.targetPpm)} at {conf} confidence ·{' '}
            {formatCount(r.samples)} common samples, seed {r.seed}
          </>
        }
      >
        Tolerance plan
      </PageTitle>
      <SafetyCaution compact />
      {!chosen && (
        <Panel>
          <p className="text-sm text-brick" role="alert">
            No plan meets {formatPpm(r.targetPpm)}: even the tightest classes leave a higher upper bound. The
            frontier below shows what each price buys.
          </p>
        </Panel>
      )}
      {chosen && (
        <div className="grid gap-4 lg:grid-cols-2">
          <Panel title="Chosen plan">
            <Table
              className="w-full text-sm"
              head={
                <>
                  <th className="py-1">Part</th>
                  <th>Kind</th>
                  <th>Class</th>
                  <th className="text-right">Price</th>
                </>
              }
            >
              {r.parts.map((p) => {
                const tol = chosen.assignment.classes[p.name];
                const price = p.classes.find((k) => k.tolerance === tol)?.price;
                return (
                  <tr key={p.name} className="border-b border-rule/60">
                    <td className="py-1 font-medium">{p.name.toUpperCase()}</td>
                    <td>{KIND_LABELS[p.kind]}</td>
                    <td className="num">± {tol} %</td>
                    <td className="num text-right">{formatMoney(price, r.currency)}</td>
                  </tr>
                );
              })}
              <tr className="border-b border-rule/60">
                <td className="py-1 font-medium">Tube</td>
                <td colSpan={2}>
                  {chosen.assignment.tube === 'matched'
                    ? `sections matched on ${r.matchRule.quantity === 'ia' ? 'Ia' : r.matchRule.quantity} within ± ${r.matchRule.within} %`
                    : 'unmatched'}
                </td>
                <td className="num text-right">
                  {formatMoney(
                    chosen.cost -
                      r.parts.reduce(
                        (s, p) =>
                          s +
                          (p.classes.find((k) => k.tolerance === chosen.assignment.classes[p.name])?.price ??
                            0),
                        0,
                      ),
                    r.currency,
                  )}
                </td>
              </tr>
              <tr>
                <td className="py-1 font-semibold" colSpan={3}>
                  Per unit
                </td>
                <td className="num text-right font-semibold">{formatMoney(chosen.cost, r.currency)}</td>
              </tr>
            </Table>
          </Panel>
          <Panel title="Reject rate: estimate and confirming run">
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm" data-testid="plan-intervals">
              <dt className="text-dim">Search estimate</dt>
              <dd className="num">
                {formatYield(1 - chosen.rejectPpm / 1e6)} yield · {formatPpm(chosen.rejectPpm)}{' '}
                <span className="text-dim">
                  ({formatPpm(chosen.lowPpm)} – {formatPpm(chosen.highPpm)}, {conf})
                </span>
                <span className="block text-xs text-dim">
                  {chosen.fails} rejects in {formatCount(chosen.samples)} common samples
                </span>
              </dd>
              <dt className="text-dim">Confirming run</dt>
              <dd className="num">
                {!c && <span className="text-dim">none launched</span>}
                {c && c.status !== 'done' && (
                  <span>
                    <Link to={`/runs/${c.runId}`} className="text-petrol hover:underline">
                      run
                    </Link>{' '}
                    {c.status}…
                  </span>
                )}
                {c && c.status === 'done' && c.rejectPpm !== null && (
                  <>
                    {formatPpm(c.rejectPpm)}{' '}
                    <span className="text-dim">
                      ({formatPpm(c.lowPpm!)} – {formatPpm(c.highPpm!)}, 95 %)
                    </span>
                    <span className="block text-xs text-dim">
                      <Link to={`/runs/${c.runId}`} className="text-petrol hover:underline">
                        ordinary run
                      </Link>{' '}
                      of revision {c.revision}, {formatCount(c.samples)} samples, seed {c.seed}
                    </span>
                  </>
                )}
              </dd>
              {c?.status === 'done' && c.lowPpm !== null && (
                <>
                  <dt className="text-dim">Agreement</dt>
                  <dd>
                    {c.lowPpm <= chosen.highPpm && c.highPpm! >= chosen.lowPpm
                      ? 'The intervals overlap: the run confirms the estimate.'
                      : 'The intervals do not overlap: look at the run before buying.'}
                  </dd>
                </>
              )}
            </dl>
          </Panel>
        </div>
      )}
      <ChartFrame
        title="Cost against reject rate (frontier)"
        fileName="plan-frontier"
        note={`Each dot is the cheapest plan for a reject-rate target; bars are ${conf} intervals. ${formatCount(r.judged)} of ${formatCount(r.candidates)} candidate plans judged, ${formatCount(r.kernelEvaluations)} stage evaluations.`}
      >
        {(ref) => (
          <FrontierChart
            svgRef={ref}
            currency={r.currency}
            targetPpm={r.targetPpm}
            points={r.frontier.map((p) => ({
              ...p,
              chosen:
                !!chosen &&
                p.cost === chosen.cost &&
                JSON.stringify(p.assignment) === JSON.stringify(chosen.assignment),
            }))}
            confirm={
              chosen && c?.status === 'done' && c.rejectPpm !== null
                ? { cost: chosen.cost, rejectPpm: c.rejectPpm, lowPpm: c.lowPpm!, highPpm: c.highPpm! }
                : null
            }
          />
        )}
      </ChartFrame>
      <Panel title="Frontier">
        <Table
          className="w-full text-sm"
          head={
            <>
              <th className="py-1">For target</th>
              <th className="text-right">Cost per unit</th>
              <th className="text-right">Yield</th>
              <th className="text-right">Reject rate</th>
              <th className="pr-4 text-right">Interval</th>
              <th>Classes</th>
              <th>Tube</th>
            </>
          }
        >
          {r.frontier.map((p, i) => (
            <tr key={i} className="border-b border-rule/60">
              <td className="num py-1">{formatPpm(p.targetPpm)}</td>
              <td className="num text-right">{formatMoney(p.cost, r.currency)}</td>
              <td className="num text-right">{formatYield(1 - p.rejectPpm / 1e6)}</td>
              <td className="num text-right">{formatPpm(p.rejectPpm)}</td>
              <td className="num pr-4 text-right text-dim">
                {formatPpm(p.lowPpm)} – {formatPpm(p.highPpm)}
              </td>
              <td className="num">
                {r.parts.map((q) => `${q.name.toUpperCase()} ${p.assignment.classes[q.name]} %`).join(' · ')}
              </td>
              <td>{p.assignment.tube}</td>
            </tr>
          ))}
        </Table>
      </Panel>
    </>
  );
}
