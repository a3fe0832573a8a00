import { METRIC_IDS } from '@sigmatail/engine';
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { ApiError } from '../api/client.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { lotsApi } from '../api/lotsApi.js';
import { runQueries } from '../api/queries/runQueries.js';
import { ChartFrame } from '../charts/ChartFrame.js';
import { GuardBandChart } from '../charts/GuardBandChart.js';
import { ChoiceField } from '../components/ChoiceField.js';
import { Field } from '../components/Field.js';
import { Table } from '../components/Table.js';
import { TextField } from '../components/TextField.js';
import { Button, inputClass, PageTitle, Panel } from '../components/ui.js';
import { formatPercent, formatPpm, formatSig } from '../format/formatSi.js';
import { readTestLimitsForm, SERVER_FIELD, type TestLimitsForm } from '../testLimits/readTestLimitsForm.js';

const START: TestLimitsForm = {
  source: 'given',
  mean: '',
  sd: '',
  runId: '',
  metric: 'balanceDb',
  measurementSd: '',
  specLow: '',
  specHigh: '',
  testLow: '',
  testHigh: '',
  targetPpm: '100',
};

/** Guard band calculator: false accept / false reject of test limits, and a guard band for a target. */
export function TestLimitsPage() {
  const [f, setF] = useState<TestLimitsForm>(START);
  const maySave = can(useMe().role, 'planProduction');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const runs = useQuery({ ...runQueries.list(), enabled: f.source === 'run' });
  const compute = useMutation({
    mutationFn: lotsApi.testLimits,
    onError: (err) => {
      const key = err instanceof ApiError && err.field ? (SERVER_FIELD[err.field] ?? 'form') : 'form';
      setErrors({ [key]: err.message });
    },
  });
  const set = (k: keyof TestLimitsForm) => (e: { target: { value: string } }) =>
    setF({ ...f, [k]: e.target.value });
  const note = (k: string) =>
    errors[k] ? (
      <p className="mt-1 text-xs text-brick" role="alert">
        {errors[k]}
      </p>
    ) : null;
  const num = (id: Exclude<keyof TestLimitsForm, 'save' | 'source'>, label: string, placeholder?: string) => (
    <TextField
      id={`tl-${id}`}
      label={label}
      numeric
      inputMode="decimal"
      placeholder={placeholder}
      value={f[id]}
      onChange={set(id)}
      note={note(id)}
    />
  );
  function submit(e: FormEvent) {
    e.preventDefault();
    const r = readTestLimitsForm(f);
    setErrors(r.errors);
    if (r.request) compute.mutate(r.request);
  }
  const a = compute.data;
  return (
    <div className="space-y-4">
      <Link to="/production/lots" className="text-sm text-dim underline">
        ← Lots
      </Link>
      <PageTitle sub="End-of-line test of one quantity: how many bad parts pass (false accept) and good parts fail (false reject) for given measurement uncertainty and test limits, and how far inside the spec to put the test limits for a target false-accept rate. Process and measurement error normal.">
        Test limits and guard bands
      </PageTitle>
      <Panel title="Inputs">
        <form onSubmit={submit} noValidate aria-label="Guard band calculator" className="space-y-3">
          <div className="grid gap-3 sm:grid-cols-3">
            <ChoiceField
              id="tl-source"
              label="Process distribution"
              value={f.source}
              choices={['given', 'run'] as const}
              labelOf={(s) => (s === 'given' ? 'Mean and sd I give' : 'From a stored run’s metric')}
              onChange={(source) => setF({ ...f, source })}
            />
            {f.source === 'given' ? (
              <>
                {num('mean', 'Process mean')}
                {num('sd', 'Process sd')}
              </>
            ) : (
              <>
                <Field id="tl-runId" label="Run">
                  <select id="tl-runId" className={inputClass} value={f.runId} onChange={set('runId')}>
                    <option value="">Choose…</option>
                    {runs.data
                      ?.filter((r) => r.status === 'done')
                      .map((r) => (
                        <option key={r.id} value={r.id}>
                          {r.designName} r{r.revision} · {r.samples.toLocaleString('en')} samples
                        </option>
                      ))}
                  </select>
                  {note('runId')}
                </Field>
                <div>
                  <ChoiceField
                    id="tl-metric"
                    label="Metric"
                    value={f.metric}
                    choices={METRIC_IDS}
                    onChange={(metric) => setF({ ...f, metric })}
                  />
                  {note('metric')}
                </div>
                {maySave && (
                  <label className="flex items-center gap-2 self-end pb-2 text-sm">
                    <input
                      type="checkbox"
                      checked={f.save ?? false}
                      onChange={(e) => setF({ ...f, save: e.target.checked })}
                    />
                    Save as this design’s test limits (shown in its production report)
                  </label>
                )}
              </>
            )}
            {num('measurementSd', 'Measurement sd (same unit)')}
            {num('specLow', 'Spec low', 'none')}
            {num('specHigh', 'Spec high', 'none')}
            {num('testLow', 'Test low', 'spec low')}
            {num('testHigh', 'Test high', 'spec high')}
            {num('targetPpm', 'Target false accept (PPM)', 'none')}
          </div>
          {note('form')}
          <Button tone="primary" type="submit" disabled={compute.isPending}>
            {compute.isPending ? 'Computing…' : 'Compute'}
          </Button>
        </form>
      </Panel>
      {a?.saved && (
        <p role="status" className="text-sm text-moss">
          Saved as the test limits of the run’s design; its production report shows them.
        </p>
      )}
      {a && (
        <Panel title="Results">
          <div className="grid gap-4 lg:grid-cols-2">
            <div className="space-y-3">
              <Table
                className="w-full text-sm"
                head={
                  <>
                    <th className="py-1 pr-3" />
                    <th className="py-1 pr-3">Test limits</th>
                    {a.suggestion && <th className="py-1">Suggested</th>}
                  </>
                }
              >
                {(
                  [
                    [
                      'Limits',
                      (r: typeof a.test) =>
                        `${r.low === undefined ? '−∞' : formatSig(r.low, 5)} … ${r.high === undefined ? '∞' : formatSig(r.high, 5)}`,
                    ],
                  ] as const
                ).map(([k, fn]) => (
                  <tr key={k}>
                    <td className="py-1 pr-3 text-dim">{k}</td>
                    <td className="num py-1 pr-3">{fn(a.test)}</td>
                    {a.suggestion && <td className="num py-1">{fn(a.suggestion.test)}</td>}
                  </tr>
                ))}
                {(
                  [
                    ['False accept', 'falseAccept'],
                    ['False reject', 'falseReject'],
                    ['Escapes among accepted', 'escapeRate'],
                  ] as const
                ).map(([k, key]) => (
                  <tr key={k}>
                    <td className="py-1 pr-3 text-dim">{k}</td>
                    <td className="num py-1 pr-3" data-testid={`rate-${key}`}>
                      {formatPpm(a.rates[key] * 1e6)}
                    </td>
                    {a.suggestion && <td className="num py-1">{formatPpm(a.suggestion.rates[key] * 1e6)}</td>}
                  </tr>
                ))}
                <tr>
                  <td className="py-1 pr-3 text-dim">Accepted</td>
                  <td className="num py-1 pr-3">{formatPercent(a.rates.accepted, 2)}</td>
                  {a.suggestion && (
                    <td className="num py-1">{formatPercent(a.suggestion.rates.accepted, 2)}</td>
                  )}
                </tr>
              </Table>
              {a.suggestion && (
                <p className="text-sm" data-testid="guard-band">
                  {a.suggestion.reached ? (
                    <>
                      Guard band <strong className="num">{formatSig(a.suggestion.guardBand, 4)}</strong>{' '}
                      inside each spec limit meets {f.targetPpm} PPM false accept.
                    </>
                  ) : (
                    <span className="text-brick">
                      No guard band up to 6 measurement sd reaches the target: the tester is too coarse for
                      these limits.
                    </span>
                  )}
                </p>
              )}
              <p className="text-xs text-dim">
                Process mean {formatSig(a.process.mean, 4)}, sd {formatSig(a.process.sd, 3)}
                {a.process.runId ? ` (from the run's ${a.process.metric})` : ''}. Rates are shares of all
                parts tested.
              </p>
            </div>
            <ChartFrame title="Process and limits" fileName="guard-band">
              {(ref) => (
                <GuardBandChart
                  svgRef={ref}
                  mean={a.process.mean}
                  sd={a.process.sd}
                  measurementSd={Number(f.measurementSd)}
                  spec={a.spec}
                  test={a.suggestion?.test ?? a.test}
                />
              )}
            </ChartFrame>
          </div>
        </Panel>
      )}
    </div>
  );
}
