import { DEFAULT_AGEING_SCENARIO, RESISTOR_KINDS, type ResistorKind } from '@sigmatail/engine';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { productionApi } from '../api/productionApi.js';
import { productionQueries } from '../api/queries/productionQueries.js';
import type { AgeingScenario, AgeingStudy } from '../api/productionTypes.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ChartFrame } from '../charts/ChartFrame.js';
import { PairingBars } from '../charts/PairingBars.js';
import { ErrorNote, QueryStatus } from '../components/QueryState.js';
import { Table } from '../components/Table.js';
import { TextField } from '../components/TextField.js';
import { Button, inputClass, PageTitle, Panel } from '../components/ui.js';
import { formatCount, formatPercent, formatPpm, formatSig } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { metricInfo } from '../results/metricInfo.js';
import { DesignPicker } from '../production/DesignPicker.js';
import { fieldError, namesField } from '../production/fieldError.js';
import { KIND_LABELS } from '../production/kindLabels.js';

type DriftText = { shift: string; sd: string; source: string };
const toText = (d: { shift: number; sd: number; source: string }): DriftText => ({
  shift: String(d.shift),
  sd: String(d.sd),
  source: d.source,
});

/** Apply an ageing scenario to a design: new and aged side by side, margin to each spec. */
export function AgeingPage() {
  const [designId, setDesignId] = useState('');
  return (
    <div className="space-y-5">
      <PageTitle sub="The same units, new and after ageing: resistors drift by kind, tube sections lose emission.">
        Ageing
      </PageTitle>
      <AgeingForm designId={designId} setDesignId={setDesignId} />
      {designId && <LatestAgeing designId={designId} />}
    </div>
  );
}

function AgeingForm({ designId, setDesignId }: { designId: string; setDesignId: (id: string) => void }) {
  const me = useMe();
  const qc = useQueryClient();
  const allowed = can(me.role, 'planProduction');
  const d = DEFAULT_AGEING_SCENARIO;
  const [name, setName] = useState(d.name);
  const [drift, setDrift] = useState<Record<ResistorKind, DriftText>>({
    'metal-film': toText(d.resistors['metal-film']),
    'carbon-film': toText(d.resistors['carbon-film']),
    'carbon-comp': toText(d.resistors['carbon-comp']),
  });
  const [emission, setEmission] = useState<DriftText>(toText(d.emission));
  const [samples, setSamples] = useState('20000');
  const [tried, setTried] = useState(false);
  const inRange = (s: string, lo: number, hi: number) =>
    s.trim() !== '' && Number(s) >= lo && Number(s) <= hi;
  const driftErrors = (t: DriftText, shiftLo: number, shiftHi: number, shiftWhat: string) => ({
    shift: inRange(t.shift, shiftLo, shiftHi) ? null : `${shiftWhat} from ${shiftLo} to ${shiftHi} %`,
    sd: inRange(t.sd, 0, 50) ? null : 'A spread from 0 to 50 %',
    source: t.source.trim() ? null : 'Say where the figure comes from (or "from memory")',
  });
  const errs = {
    ...Object.fromEntries(RESISTOR_KINDS.map((k) => [k, driftErrors(drift[k], -50, 50, 'A shift')])),
    emission: driftErrors(emission, 0, 90, 'A loss'),
  } as Record<ResistorKind | 'emission', { shift: string | null; sd: string | null; source: string | null }>;
  const sampleErr =
    Number.isInteger(Number(samples)) && Number(samples) >= 1000 && Number(samples) <= 200_000
      ? null
      : 'A whole number from 1,000 to 200,000';
  const ok =
    !!designId &&
    !sampleErr &&
    name.trim() !== '' &&
    Object.values(errs).every((e) => !e.shift && !e.sd && !e.source);
  const scenario = (): AgeingScenario => {
    const n = (t: DriftText) => ({ shift: Number(t.shift), sd: Number(t.sd), source: t.source.trim() });
    return {
      name: name.trim(),
      resistors: {
        'metal-film': n(drift['metal-film']),
        'carbon-film': n(drift['carbon-film']),
        'carbon-comp': n(drift['carbon-comp']),
      },
      emission: n(emission),
    };
  };
  const run = useMutation({
    mutationFn: () => productionApi.age({ designId, scenario: scenario(), samples: Number(samples) }),
    onSuccess: () => qc.invalidateQueries({ queryKey: [...productionQueries.all, 'ageing', designId] }),
  });
  const show = (local: string | null, field: string) => (tried && local) || fieldError(run.error, field);
  const Note = ({ text }: { text: string | null | false }) =>
    text ? <p className="mt-0.5 text-xs text-brick">{text}</p> : null;
  const row = (
    key: ResistorKind | 'emission',
    label: string,
    t: DriftText,
    set: (t: DriftText) => void,
    field: string,
  ) => (
    <tr key={key} className="border-b border-rule/60 align-top">
      <td className="py-1 pr-2 font-medium">{label}</td>
      {(['shift', 'sd', 'source'] as const).map((f) => (
        <td key={f} className="pr-2">
          <input
            aria-label={`${label} ${f === 'sd' ? 'spread' : f}`}
            className={f === 'source' ? inputClass : `${inputClass} num`}
            value={t[f]}
            onChange={(e) => set({ ...t, [f]: e.target.value })}
            aria-invalid={!!show(errs[key][f], `${field}.${f}`)}
          />
          <Note text={show(errs[key][f], `${field}.${f}`)} />
        </td>
      ))}
    </tr>
  );
  return (
    <Panel title="Ageing scenario">
      {!allowed && (
        <p className="mb-3 text-sm text-dim">Your role ({me.role}) can read results but not age a design.</p>
      )}
      <form
        aria-label="Apply ageing"
        onSubmit={(e) => {
          e.preventDefault();
          setTried(true);
          if (ok) run.mutate();
        }}
      >
        <fieldset disabled={!allowed || run.isPending} className="space-y-3">
          <div className="grid gap-3 sm:grid-cols-3">
            <DesignPicker
              id="ageing-design"
              value={designId}
              onChange={setDesignId}
              error={show(designId ? null : 'Choose a design', 'designId')}
            />
            <TextField
              id="ageing-name"
              label="Scenario name"
              value={name}
              onChange={(e) => setName(e.target.value)}
              note={<Note text={show(name.trim() ? null : 'Name the scenario', 'scenario.name')} />}
            />
            <TextField
              id="ageing-samples"
              label="Units sampled"
              numeric
              inputMode="numeric"
              value={samples}
              onChange={(e) => setSamples(e.target.value)}
              note={<Note text={show(sampleErr, 'samples')} />}
            />
          </div>
          <Table
            className="w-full text-sm"
            head={
              <>
                <th className="py-1">Drift</th>
                <th>Mean shift (%)</th>
                <th>Spread, 1σ (%)</th>
                <th>Source</th>
              </>
            }
          >
            {RESISTOR_KINDS.map((k) =>
              row(
                k,
                KIND_LABELS[k],
                drift[k],
                (t) => setDrift((d0) => ({ ...d0, [k]: t })),
                `scenario.resistors.${k}`,
              ),
            )}
            {row('emission', 'Tube emission loss', emission, setEmission, 'scenario.emission')}
          </Table>
          <p className="text-xs text-dim">
            A resistor&apos;s value moves by shift ± spread (+ = rises). Emission loss is the share of cathode
            current capability each section loses; it scales the section&apos;s perveance. Parts without a
            kind are metal film.
          </p>
          <Button type="submit" tone="primary">
            {run.isPending ? 'Ageing…' : 'Apply ageing'}
          </Button>
        </fieldset>
        {run.isError && !namesField(run.error, ['designId', 'samples', 'scenario']) && (
          <div className="mt-3">
            <ErrorNote error={run.error} />
          </div>
        )}
      </form>
    </Panel>
  );
}

function LatestAgeing({ designId }: { designId: string }) {
  const latest = useQuery(productionQueries.latestAgeing(designId));
  if (latest.isPending || latest.isError)
    return <QueryStatus query={latest} label="Loading the latest ageing result…" />;
  if (!latest.data) return <p className="text-sm text-dim">No ageing result saved for this design yet.</p>;
  return <AgeingResultView study={latest.data} />;
}

function AgeingResultView({ study }: { study: AgeingStudy }) {
  const r = study.result;
  const fmt = (v: number | null) => (v === null || !Number.isFinite(v) ? '—' : formatSig(v, 3));
  return (
    <div className="space-y-4" data-testid="ageing-result">
      <p className="text-xs text-dim">
        “{r.scenario.name}” on revision {study.revision}, {formatCount(r.samples)} units, seed {r.seed}, saved{' '}
        {formatWhen(study.created_at)}.
      </p>
      <ChartFrame title="Reject rate, new and aged (95 % interval)" fileName="ageing-reject-rate">
        {(ref) => (
          <PairingBars
            svgRef={ref}
            width={900}
            unit="reject rate (PPM)"
            format={formatPpm}
            bars={[
              { label: 'New', value: r.asNew.rejectPpm, low: r.asNew.lowPpm, high: r.asNew.highPpm },
              { label: 'Aged', value: r.aged.rejectPpm, low: r.aged.lowPpm, high: r.aged.highPpm },
            ]}
          />
        )}
      </ChartFrame>
      <Panel title="Margin to each spec">
        <Table
          className="w-full text-sm"
          head={
            <>
              <th className="py-1">Spec</th>
              <th>Limits</th>
              <th className="text-right">Mean new → aged</th>
              <th className="text-right">Pass new → aged</th>
              <th className="text-right">Margin new → aged</th>
              <th className="text-right">Margin in σ (aged)</th>
            </>
          }
        >
          {r.asNew.specs.map((s, i) => {
            const a = r.aged.specs[i];
            return (
              <tr key={i} className="border-b border-rule/60">
                <td className="py-1">
                  {s.label ?? s.metric}
                  {unitOf(s.metric) && <span className="text-dim"> ({unitOf(s.metric)})</span>}
                </td>
                <td className="num text-dim">
                  {s.min ?? '−∞'} … {s.max ?? '∞'}
                </td>
                <td className="num text-right">
                  {fmt(s.mean)} → {fmt(a.mean)}
                </td>
                <td className="num text-right">
                  {formatPercent(s.passRate, 2)} → {formatPercent(a.passRate, 2)}
                </td>
                <td className={`num text-right ${a.margin < s.margin ? 'text-brick' : ''}`}>
                  {fmt(s.margin)} → {fmt(a.margin)}
                </td>
                <td className="num text-right">{fmt(a.marginSd)}</td>
              </tr>
            );
          })}
        </Table>
        <p className="mt-2 text-xs text-dim">
          Margin: distance from the mean to the nearest limit, in the metric&apos;s unit (red where ageing
          eats into it).
        </p>
      </Panel>
      <Panel title="Scenario figures and sources">
        <ul className="text-sm">
          {RESISTOR_KINDS.map((k) => (
            <li key={k}>
              {KIND_LABELS[k]}: {r.scenario.resistors[k].shift} % ± {r.scenario.resistors[k].sd} %{' '}
              <span className="text-dim">({r.scenario.resistors[k].source})</span>
            </li>
          ))}
          <li>
            Tube emission loss: {r.scenario.emission.shift} % ± {r.scenario.emission.sd} %{' '}
            <span className="text-dim">({r.scenario.emission.source})</span>
          </li>
        </ul>
      </Panel>
    </div>
  );
}

/** The metric's SI unit ('' for ratios). */
function unitOf(metric: string): string {
  return metricInfo(metric).unit;
}
