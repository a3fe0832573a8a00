import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import { productionApi } from '../api/productionApi.js';
import { designQueries } from '../api/queries/designQueries.js';
import { productionQueries } from '../api/queries/productionQueries.js';
import { runQueries } from '../api/queries/runQueries.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ChoiceField } from '../components/ChoiceField.js';
import { ErrorNote, QueryStatus } from '../components/QueryState.js';
import { Table } from '../components/Table.js';
import { TextField } from '../components/TextField.js';
import { Button, PageTitle, Panel } from '../components/ui.js';
import { formatPpm } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { DesignPicker } from '../production/DesignPicker.js';
import { fieldError, namesField } from '../production/fieldError.js';
import { formatMoney } from '../production/formatMoney.js';

/** Saved tolerance plans and the form that searches a new one. */
export function PlansPage() {
  const plans = useQuery(productionQueries.plans());
  return (
    <div className="space-y-5">
      <PageTitle sub="The cheapest tolerance classes (and tube option) that meet a reject-rate target at a confidence, with the cost-versus-yield frontier.">
        Tolerance plans
      </PageTitle>
      <NewPlanForm />
      <Panel title="Saved plans">
        <QueryStatus query={plans} label="Loading plans…" />
        {plans.data?.length === 0 && <p className="text-sm text-dim">No saved plans yet.</p>}
        {!!plans.data?.length && (
          <Table
            className="w-full text-sm"
            head={
              <>
                <th className="py-1">Design</th>
                <th>Target</th>
                <th>Cost per unit</th>
                <th>Estimate</th>
                <th>Saved</th>
              </>
            }
          >
            {plans.data.map((p) => (
              <tr key={p.id} className="border-b border-rule/60">
                <td className="py-1.5">
                  <Link to={`/production/plans/${p.id}`} className="font-medium text-petrol hover:underline">
                    {p.designName} rev {p.revision}
                  </Link>
                </td>
                <td className="num">{formatPpm(p.target.targetPpm)}</td>
                <td className="num">
                  {p.result.chosen ? formatMoney(p.result.chosen.cost, p.result.currency) : 'not met'}
                </td>
                <td className="num">{p.result.chosen ? formatPpm(p.result.chosen.rejectPpm) : '—'}</td>
                <td className="text-dim">{formatWhen(p.createdAt)}</td>
              </tr>
            ))}
          </Table>
        )}
      </Panel>
    </div>
  );
}

type TargetKind = 'ppm' | 'yield';

function NewPlanForm() {
  const me = useMe();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const allowed = can(me.role, 'planProduction');
  const [designId, setDesignId] = useState('');
  const [targetKind, setTargetKind] = useState<TargetKind>('ppm');
  const [target, setTarget] = useState('1000');
  const [confidence, setConfidence] = useState('0.95');
  const [samples, setSamples] = useState('20000');
  const [confirmSamples, setConfirmSamples] = useState('200000');
  const [tried, setTried] = useState(false);
  const t = Number(target);
  const local = {
    designId: designId ? null : 'Choose a design',
    target:
      targetKind === 'ppm'
        ? t > 0 && t < 1e6
          ? null
          : 'A reject rate in PPM, above 0 and below 1,000,000'
        : t > 0 && t < 100
          ? null
          : 'A yield in percent, above 0 and below 100',
    confidence:
      Number(confidence) >= 0.8 && Number(confidence) <= 0.999 ? null : 'A confidence from 0.8 to 0.999',
    samples:
      Number.isInteger(Number(samples)) && Number(samples) >= 1000 && Number(samples) <= 200_000
        ? null
        : 'A whole number from 1,000 to 200,000',
    confirmSamples:
      Number(confirmSamples) === 0 ||
      (Number.isInteger(Number(confirmSamples)) &&
        Number(confirmSamples) >= 10_000 &&
        Number(confirmSamples) <= 5_000_000)
        ? null
        : '0 (no confirming run) or a whole number from 10,000 to 5,000,000',
  };
  const create = useMutation({
    mutationFn: () =>
      productionApi.createPlan({
        designId,
        ...(targetKind === 'ppm' ? { targetPpm: t } : { targetYield: t }),
        confidence: Number(confidence),
        samples: Number(samples),
        confirmSamples: Number(confirmSamples),
      }),
    onSuccess: async ({ plan }) => {
      // A confirming run adds a design revision and a run.
      await Promise.all(
        [productionQueries.all, designQueries.all, runQueries.all].map((queryKey) =>
          qc.invalidateQueries({ queryKey }),
        ),
      );
      navigate(`/production/plans/${plan.id}`);
    },
  });
  const err = (key: keyof typeof local, field: string = key) =>
    (tried && local[key]) || fieldError(create.error, field);
  const Note = ({ text }: { text: string | null | false }) =>
    text ? <p className="mt-0.5 text-xs text-brick">{text}</p> : null;
  return (
    <Panel title="Plan tolerances">
      {!allowed && (
        <p className="mb-3 text-sm text-dim">Your role ({me.role}) can read plans but not search new ones.</p>
      )}
      <form
        aria-label="Plan tolerances"
        onSubmit={(e) => {
          e.preventDefault();
          setTried(true);
          if (Object.values(local).every((v) => v === null)) create.mutate();
        }}
      >
        <fieldset disabled={!allowed || create.isPending} className="grid gap-3 sm:grid-cols-3">
          <DesignPicker id="plan-design" value={designId} onChange={setDesignId} error={err('designId')} />
          <ChoiceField
            id="plan-target-kind"
            label="Target as"
            value={targetKind}
            choices={['ppm', 'yield'] as const}
            labelOf={(k) => (k === 'ppm' ? 'Reject rate (PPM)' : 'Yield (%)')}
            onChange={setTargetKind}
          />
          <TextField
            id="plan-target"
            label={targetKind === 'ppm' ? 'Target reject rate (PPM)' : 'Target yield (%)'}
            numeric
            inputMode="decimal"
            value={target}
            onChange={(e) => setTarget(e.target.value)}
            aria-invalid={!!err('target', targetKind === 'ppm' ? 'targetPpm' : 'targetYield')}
            note={<Note text={err('target', targetKind === 'ppm' ? 'targetPpm' : 'targetYield')} />}
          />
          <TextField
            id="plan-confidence"
            label="Confidence (upper bound of the reject rate)"
            numeric
            inputMode="decimal"
            value={confidence}
            onChange={(e) => setConfidence(e.target.value)}
            note={<Note text={err('confidence')} />}
          />
          <TextField
            id="plan-samples"
            label="Common samples per candidate"
            numeric
            inputMode="numeric"
            value={samples}
            onChange={(e) => setSamples(e.target.value)}
            note={<Note text={err('samples')} />}
          />
          <TextField
            id="plan-confirm"
            label="Confirming run samples (0 = none)"
            numeric
            inputMode="numeric"
            value={confirmSamples}
            onChange={(e) => setConfirmSamples(e.target.value)}
            note={<Note text={err('confirmSamples')} />}
          />
          <div className="flex items-end sm:col-span-3">
            <Button type="submit" tone="primary">
              {create.isPending ? 'Searching…' : 'Find the cheapest plan'}
            </Button>
          </div>
        </fieldset>
        <p className="mt-2 text-xs text-dim">
          A confirming run saves a new revision of the design with the chosen classes and runs it with another
          seed.
        </p>
        {create.isError &&
          !namesField(create.error, [
            'designId',
            'targetPpm',
            'targetYield',
            'confidence',
            'samples',
            'confirmSamples',
          ]) && (
            <div className="mt-3">
              <ErrorNote error={create.error} />
            </div>
          )}
      </form>
    </Panel>
  );
}
