import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { designQueries } from '../api/queries/designQueries.js';
import { productionQueries } from '../api/queries/productionQueries.js';
import { QueryStatus } from '../components/QueryState.js';
import { PageTitle, Panel } from '../components/ui.js';
import { formatPpm } from '../format/formatSi.js';
import { formatMoney } from '../production/formatMoney.js';

const AREAS = [
  {
    to: '/production/plans',
    title: 'Tolerance plans',
    text: 'Cheapest tolerance classes that meet a reject-rate target, with the cost-versus-yield frontier.',
  },
  {
    to: '/production/pairing',
    title: 'Pairing strategies',
    text: 'Unmatched tubes, matched sections or binned pairs: reject rate, cost per good unit, tubes thrown away.',
  },
  {
    to: '/production/ageing',
    title: 'Ageing',
    text: 'Resistor drift and tube emission loss: new and aged side by side, margin to each spec.',
  },
  {
    to: '/production/prices',
    title: 'Price table',
    text: 'What resistors (by kind and class) and tubes (unmatched, matched) cost the workshop.',
  },
  { to: '/production/lots', title: 'Measured lots', text: 'Upload measured part and tube values of a lot.' },
  { to: '/production/limits', title: 'Test limits', text: 'End-of-line test limits per metric.' },
];

/** The production lead's home: the planning areas and the latest saved plans. */
export function ProductionPage() {
  const plans = useQuery(productionQueries.plans());
  const designs = useQuery(designQueries.list(''));
  return (
    <div className="space-y-5">
      <PageTitle sub="Plan tolerances and tube pairing for the parts you buy, and see how units age.">
        Production
      </PageTitle>
      <nav aria-label="Production areas" className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {AREAS.map((a) => (
          <Link key={a.to} to={a.to} className="rounded-lg border border-rule bg-sheet p-4 hover:border-glow">
            <span className="block font-semibold text-petrol">{a.title}</span>
            <span className="mt-1 block text-sm text-dim">{a.text}</span>
          </Link>
        ))}
      </nav>
      <Panel title="Latest saved plans">
        <QueryStatus query={plans} label="Loading plans…" />
        {plans.data?.length === 0 && <p className="text-sm text-dim">No saved plans yet.</p>}
        <ul className="divide-y divide-rule">
          {plans.data?.slice(0, 5).map((p) => (
            <li key={p.id} className="flex flex-wrap items-baseline justify-between gap-2 py-2 text-sm">
              <Link
                to={`/production/plans/${p.id}`}
                className="font-medium text-petrol underline-offset-2 hover:underline"
              >
                {p.designName} rev {p.revision} · target {formatPpm(p.target.targetPpm)}
              </Link>
              <span className="num text-dim">
                {p.result.chosen
                  ? `${formatMoney(p.result.chosen.cost, p.result.currency)} per unit · ${formatPpm(p.result.chosen.rejectPpm)}`
                  : 'no plan meets the target'}
              </span>
            </li>
          ))}
        </ul>
      </Panel>
      <Panel title="Production reports">
        <QueryStatus query={designs} label="Loading designs…" />
        <p className="mb-2 text-sm text-dim">
          One printable page per design: yield, PPM and Cpk, the plan, pairing, ageing margin and test limits.
        </p>
        <ul className="grid gap-1 sm:grid-cols-2">
          {designs.data?.map((d) => (
            <li key={d.id} className="text-sm">
              <Link
                to={`/production/report/${d.id}`}
                className="text-petrol underline-offset-2 hover:underline"
              >
                {d.name}
              </Link>
            </li>
          ))}
        </ul>
      </Panel>
    </div>
  );
}
