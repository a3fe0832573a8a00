import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { productionApi } from '../api/productionApi.js';
import { designQueries } from '../api/queries/designQueries.js';
import { lotQueries } from '../api/lotsApi.js';
import { productionQueries } from '../api/queries/productionQueries.js';
import type { EnvelopeRule, PairingStudy } from '../api/productionTypes.js';
import { ChartFrame } from '../charts/ChartFrame.js';
import { PairingBars } from '../charts/PairingBars.js';
import { SERIES_COLOURS } from '../charts/chartTheme.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote, QueryStatus } from '../components/QueryState.js';
import { Table } from '../components/Table.js';
import { TextField } from '../components/TextField.js';
import { Button, inputClass, PageTitle, Panel } from '../components/ui.js';
import { formatCount, formatPercent, formatPpm } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { DesignPicker } from '../production/DesignPicker.js';
import { fieldError, namesField } from '../production/fieldError.js';
import { formatMoney } from '../production/formatMoney.js';
import { parseLot } from '../production/parseLot.js';
import { ruleLabel } from '@sigmatail/engine';

type Quantity = 'ia' | 'gm' | 'mu';

/** Compare unmatched tubes, matched sections and binned pairs for one design. */
export function PairingPage() {
  const [designId, setDesignId] = useState('');
  return (
    <div className="space-y-5">
      <PageTitle sub="Tubes are bought unmatched and sorted in house: what each strategy rejects, throws away and costs per good unit.">
        Pairing strategies
      </PageTitle>
      <PairingForm designId={designId} setDesignId={setDesignId} />
      {designId && <LatestPairing designId={designId} />}
    </div>
  );
}

function PairingForm({ designId, setDesignId }: { designId: string; setDesignId: (id: string) => void }) {
  const me = useMe();
  const qc = useQueryClient();
  const allowed = can(me.role, 'planProduction');
  const [quantity, setQuantity] = useState<Quantity>('ia');
  const [within, setWithin] = useState('10');
  const [width, setWidth] = useState('10');
  const [bins, setBins] = useState('5');
  const [samples, setSamples] = useState('20000');
  const [lotText, setLotText] = useState('');
  const [lotId, setLotId] = useState('');
  const tubeLots = useQuery({
    ...lotQueries.list(),
    select: (lots) => lots.filter((l) => l.kind === 'tube'),
  });
  const [tried, setTried] = useState(false);
  const lot = lotText.trim() ? parseLot(lotText) : null;
  // Start the matched strategy from the design's own pairing rule, when it has one.
  const detail = useQuery({ ...designQueries.detail(designId), enabled: !!designId });
  const ownRule = (
    detail.data?.latestRevision.document as {
      tube?: { spread?: { pairing?: { quantity: Quantity; within: number } } };
    }
  )?.tube?.spread?.pairing;
  useEffect(() => {
    if (!ownRule) return;
    setQuantity(ownRule.quantity);
    setWithin(String(ownRule.within));
  }, [ownRule?.quantity, ownRule?.within]); // eslint-disable-line react-hooks/exhaustive-deps
  const pct = (s: string) => Number(s) > 0 && Number(s) < 100;
  const local = {
    designId: designId ? null : 'Choose a design',
    within: pct(within) ? null : 'A window in percent, above 0 and below 100',
    width: pct(width) ? null : 'A bin width in percent, above 0 and below 100',
    bins:
      Number.isInteger(Number(bins)) && Number(bins) >= 1 && Number(bins) <= 21
        ? null
        : 'A whole number of bins from 1 to 21',
    lot: lot && !lot.ok ? lot.message : null,
    samples:
      Number.isInteger(Number(samples)) && Number(samples) >= 1000 && Number(samples) <= 200_000
        ? null
        : 'A whole number from 1,000 to 200,000',
  };
  const strategies: EnvelopeRule[] = [
    { kind: 'unmatched' },
    { kind: 'matched', quantity, within: Number(within) },
    { kind: 'binned', quantity, width: Number(width), bins: Number(bins) },
  ];
  const run = useMutation({
    mutationFn: () =>
      productionApi.comparePairing({
        designId,
        strategies,
        samples: Number(samples),
        ...(lotId ? { lotId } : { lot: lot?.ok ? { quantity, sections: lot.sections } : undefined }),
      }),
    onSuccess: () => qc.invalidateQueries({ queryKey: [...productionQueries.all, 'pairing', designId] }),
  });
  const err = (k: keyof typeof local, field: string) => (tried && local[k]) || fieldError(run.error, field);
  const Note = ({ text }: { text: string | null | false }) =>
    text ? <p className="mt-0.5 text-xs text-brick">{text}</p> : null;
  return (
    <Panel title="Compare strategies">
      {!allowed && (
        <p className="mb-3 text-sm text-dim">
          Your role ({me.role}) can read comparisons but not run new ones.
        </p>
      )}
      <form
        aria-label="Compare pairing strategies"
        onSubmit={(e) => {
          e.preventDefault();
          setTried(true);
          if (Object.values(local).every((v) => v === null)) run.mutate();
        }}
      >
        <fieldset disabled={!allowed || run.isPending} className="grid gap-3 sm:grid-cols-3">
          <DesignPicker
            id="pairing-design"
            value={designId}
            onChange={setDesignId}
            error={err('designId', 'designId')}
          />
          <div>
            <label htmlFor="pairing-quantity" className="mb-1 block text-xs font-medium text-dim">
              Measured quantity
            </label>
            <select
              id="pairing-quantity"
              className={inputClass}
              value={quantity}
              onChange={(e) => setQuantity(e.target.value as Quantity)}
            >
              <option value="ia">Plate current Ia</option>
              <option value="gm">Transconductance gm</option>
              <option value="mu">mu</option>
            </select>
          </div>
          <TextField
            id="pairing-samples"
            label="Samples"
            numeric
            inputMode="numeric"
            value={samples}
            onChange={(e) => setSamples(e.target.value)}
            note={<Note text={err('samples', 'samples')} />}
          />
          <TextField
            id="pairing-within"
            label="Matched: sections within ± %"
            numeric
            inputMode="decimal"
            value={within}
            onChange={(e) => setWithin(e.target.value)}
            note={
              <>
                <Note text={err('within', 'strategies.1.within')} />
                {ownRule && (
                  <p className="mt-0.5 text-xs text-dim">
                    The design&apos;s own rule: {ownRule.quantity === 'ia' ? 'Ia' : ownRule.quantity} within ±{' '}
                    {ownRule.within} %
                  </p>
                )}
              </>
            }
          />
          <TextField
            id="pairing-width"
            label="Binned: bin width (%)"
            numeric
            inputMode="decimal"
            value={width}
            onChange={(e) => setWidth(e.target.value)}
            note={<Note text={err('width', 'strategies.2.width')} />}
          />
          <TextField
            id="pairing-bins"
            label="Binned: number of bins"
            numeric
            inputMode="numeric"
            value={bins}
            onChange={(e) => setBins(e.target.value)}
            note={<Note text={err('bins', 'strategies.2.bins')} />}
          />
          <div className="sm:col-span-3">
            <label htmlFor="pairing-lot-id" className="mb-1 block text-xs font-medium text-dim">
              Stored tube lot (optional)
            </label>
            <select
              id="pairing-lot-id"
              className={inputClass}
              value={lotId}
              onChange={(e) => setLotId(e.target.value)}
              aria-invalid={!!fieldError(run.error, 'lotId')}
            >
              <option value="">None: the design's tube spread model, or the values pasted below</option>
              {tubeLots.data?.map((l) => (
                <option key={l.id} value={l.id}>
                  {l.name} · {l.tubeType} · {l.count} envelopes
                </option>
              ))}
            </select>
            <Note text={fieldError(run.error, 'lotId')} />
          </div>
          <div className="sm:col-span-3">
            <label htmlFor="pairing-lot" className="mb-1 block text-xs font-medium text-dim">
              Or paste a measured lot: one envelope per line, the measured quantity of section 1 and section 2
            </label>
            <textarea
              disabled={!!lotId}
              id="pairing-lot"
              rows={3}
              className={`${inputClass} num`}
              placeholder={'1.21, 1.18\n1.05, 1.12'}
              value={lotText}
              onChange={(e) => setLotText(e.target.value)}
              aria-invalid={!!err('lot', 'lot')}
            />
            <Note text={err('lot', 'lot')} />
          </div>
          <div className="sm:col-span-3">
            <Button type="submit" tone="primary">
              {run.isPending ? 'Comparing…' : 'Compare'}
            </Button>
          </div>
        </fieldset>
        <p className="mt-2 text-xs text-dim">
          {lotId
            ? 'Tubes are drawn whole from the stored lot (both sections, both quantities, with replacement).'
            : lot?.ok
              ? `Tubes are drawn from the lot's ${lot.sections.length} envelopes (with replacement).`
              : "No lot given: tubes come from the design's tube spread model."}
        </p>
        {run.isError && !namesField(run.error, ['designId', 'samples', 'strategies', 'lot', 'lotId']) && (
          <div className="mt-3">
            <ErrorNote error={run.error} />
          </div>
        )}
      </form>
    </Panel>
  );
}

function LatestPairing({ designId }: { designId: string }) {
  const latest = useQuery(productionQueries.latestPairing(designId));
  if (latest.isPending || latest.isError)
    return <QueryStatus query={latest} label="Loading the latest comparison…" />;
  if (!latest.data) return <p className="text-sm text-dim">No comparison saved for this design yet.</p>;
  return <PairingResult study={latest.data} />;
}

function PairingResult({ study }: { study: PairingStudy }) {
  const r = study.result;
  const label = (o: (typeof r.outcomes)[number]) => ruleLabel(o.rule);
  return (
    <div className="space-y-4" data-testid="pairing-result">
      <p className="text-xs text-dim">
        Revision {study.revision}, {formatCount(r.samples)} samples, seed {r.seed}, saved{' '}
        {formatWhen(study.created_at)}.{' '}
        {r.lotSize
          ? `Tubes from a measured lot of ${formatCount(r.lotSize)} envelopes.`
          : 'Tubes from the spread model.'}{' '}
        Parts at their design tolerance cost {formatMoney(r.partsCost, r.currency)} per unit.
      </p>
      <div className="grid gap-4 lg:grid-cols-2">
        <ChartFrame title="Reject rate (95 % interval)" fileName="pairing-reject-rate">
          {(ref) => (
            <PairingBars
              svgRef={ref}
              unit="reject rate (PPM)"
              format={formatPpm}
              bars={r.outcomes.map((o) => ({
                label: label(o),
                value: o.rejectPpm,
                low: o.lowPpm,
                high: o.highPpm,
              }))}
            />
          )}
        </ChartFrame>
        <ChartFrame title="Cost per good unit" fileName="pairing-cost">
          {(ref) => (
            <PairingBars
              svgRef={ref}
              unit={`cost per good unit (${r.currency})`}
              colour={SERIES_COLOURS[1]}
              format={(v) => formatMoney(v, r.currency)}
              bars={r.outcomes.map((o) => ({ label: label(o), value: o.costPerGoodUnit ?? Infinity }))}
            />
          )}
        </ChartFrame>
      </div>
      <Panel title="Side by side">
        <Table
          className="w-full text-sm"
          head={
            <>
              <th className="py-1">Strategy</th>
              <th className="text-right">Reject rate</th>
              <th className="text-right">95 % interval</th>
              <th className="text-right">Envelopes kept</th>
              <th className="text-right">Thrown away per unit</th>
              <th className="text-right">Cost per good unit</th>
            </>
          }
        >
          {r.outcomes.map((o, i) => (
            <tr key={i} className="border-b border-rule/60">
              <td className="py-1">{label(o)}</td>
              <td className="num text-right">{formatPpm(o.rejectPpm)}</td>
              <td className="num text-right text-dim">
                {formatPpm(o.lowPpm)} – {formatPpm(o.highPpm)}
              </td>
              <td className="num text-right">
                {formatPercent(o.acceptance)}
                {o.modelAcceptance !== null && o.rule.kind !== 'unmatched' && (
                  <span className="block text-xs text-dim">model {formatPercent(o.modelAcceptance)}</span>
                )}
                {o.lotAcceptance != null && (
                  <span className="block text-xs text-dim">lot {formatPercent(o.lotAcceptance)}</span>
                )}
              </td>
              <td className="num text-right">{o.tubesThrownPerUnit.toFixed(2)} tubes</td>
              <td className="num text-right">{formatMoney(o.costPerGoodUnit, r.currency)}</td>
            </tr>
          ))}
        </Table>
      </Panel>
    </div>
  );
}
