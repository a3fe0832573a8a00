import { RESISTOR_KINDS, type ResistorKind } from '@sigmatail/engine';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { productionApi } from '../api/productionApi.js';
import { productionQueries } from '../api/queries/productionQueries.js';
import type { PriceTable } from '../api/productionTypes.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote, QueryStatus } from '../components/QueryState.js';
import { Table } from '../components/Table.js';
import { TextField } from '../components/TextField.js';
import { Button, inputClass, PageTitle, Panel } from '../components/ui.js';
import { fieldError, namesField } from '../production/fieldError.js';
import { KIND_LABELS } from '../production/kindLabels.js';

type Row = { kind: ResistorKind; tolerance: string; price: string };
const EMPTY: PriceTable = { currency: 'EUR', resistors: [], tubes: { unmatched: 0, matched: 0 } };

/** The workspace price table: resistor rows (kind × tolerance class) and the two tube prices. */
export function PricesPage() {
  const prices = useQuery(productionQueries.prices());
  return (
    <div className="space-y-5">
      <PageTitle sub="Prices per piece. Plans and pairing comparisons cost parts and tubes from this table.">
        Price table
      </PageTitle>
      <QueryStatus query={prices} label="Loading prices…" />
      {prices.data && <PricesForm initial={prices.data.prices ?? EMPTY} />}
    </div>
  );
}

const num = (s: string) => (s.trim() === '' ? NaN : Number(s));

function PricesForm({ initial }: { initial: PriceTable }) {
  const me = useMe();
  const qc = useQueryClient();
  const allowed = can(me.role, 'planProduction');
  const [currency, setCurrency] = useState(initial.currency);
  const [rows, setRows] = useState<Row[]>(
    initial.resistors.map((r) => ({ kind: r.kind, tolerance: String(r.tolerance), price: String(r.price) })),
  );
  const [unmatched, setUnmatched] = useState(String(initial.tubes.unmatched));
  const [matched, setMatched] = useState(String(initial.tubes.matched));
  const [touched, setTouched] = useState(false);
  const save = useMutation({
    mutationFn: () =>
      productionApi.savePrices({
        currency: currency.trim(),
        resistors: rows.map((r) => ({ kind: r.kind, tolerance: num(r.tolerance), price: num(r.price) })),
        tubes: { unmatched: num(unmatched), matched: num(matched) },
      }),
    onSuccess: () => qc.invalidateQueries({ queryKey: productionQueries.all }),
  });
  const tolError = (s: string) =>
    num(s) > 0 && num(s) < 100 ? null : 'A tolerance in percent, above 0 and below 100';
  const priceError = (s: string) => (num(s) >= 0 ? null : 'A price of 0 or more');
  const localErrors =
    rows.some((r) => tolError(r.tolerance) || priceError(r.price)) ||
    !!priceError(unmatched) ||
    !!priceError(matched) ||
    currency.trim() === '' ||
    rows.length === 0;
  const setRow = (i: number, patch: Partial<Row>) =>
    setRows((rs) => rs.map((r, k) => (k === i ? { ...r, ...patch } : r)));
  const show = (local: string | null, field: string) => (touched && local) || fieldError(save.error, field);
  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        setTouched(true);
        if (!localErrors) save.mutate();
      }}
    >
      <fieldset disabled={!allowed} className="space-y-4">
        {!allowed && (
          <p className="text-sm text-dim">Your role ({me.role}) can read the prices but not change them.</p>
        )}
        <Panel title="Resistors">
          <Table
            className="w-full text-sm"
            head={
              <>
                <th className="py-1">Kind</th>
                <th>Tolerance (± %)</th>
                <th>Price per piece</th>
                <th />
              </>
            }
          >
            {rows.map((r, i) => (
              <tr key={i} className="border-b border-rule/60 align-top">
                <td className="py-1 pr-2">
                  <select
                    aria-label={`Row ${i + 1} kind`}
                    className={inputClass}
                    value={r.kind}
                    onChange={(e) => setRow(i, { kind: e.target.value as ResistorKind })}
                  >
                    {RESISTOR_KINDS.map((k) => (
                      <option key={k} value={k}>
                        {KIND_LABELS[k]}
                      </option>
                    ))}
                  </select>
                </td>
                <td className="pr-2">
                  <input
                    aria-label={`Row ${i + 1} tolerance`}
                    className={`${inputClass} num`}
                    inputMode="decimal"
                    value={r.tolerance}
                    onChange={(e) => setRow(i, { tolerance: e.target.value })}
                    aria-invalid={!!show(tolError(r.tolerance), `resistors.${i}.tolerance`)}
                  />
                  <Err text={show(tolError(r.tolerance), `resistors.${i}.tolerance`)} />
                </td>
                <td className="pr-2">
                  <input
                    aria-label={`Row ${i + 1} price`}
                    className={`${inputClass} num`}
                    inputMode="decimal"
                    value={r.price}
                    onChange={(e) => setRow(i, { price: e.target.value })}
                    aria-invalid={!!show(priceError(r.price), `resistors.${i}.price`)}
                  />
                  <Err text={show(priceError(r.price), `resistors.${i}.price`)} />
                </td>
                <td>
                  <Button
                    onClick={() => setRows((rs) => rs.filter((_r, k) => k !== i))}
                    aria-label={`Remove row ${i + 1}`}
                  >
                    Remove
                  </Button>
                </td>
              </tr>
            ))}
          </Table>
          {touched && rows.length === 0 && <Err text="Add at least one resistor price" />}
          <Button
            className="mt-2"
            onClick={() => setRows((rs) => [...rs, { kind: 'metal-film', tolerance: '1', price: '' }])}
          >
            Add a row
          </Button>
        </Panel>
        <Panel title="Tubes and currency">
          <div className="grid gap-3 sm:grid-cols-3">
            <TextField
              id="price-unmatched"
              label="Tube, unmatched (per piece)"
              numeric
              inputMode="decimal"
              value={unmatched}
              onChange={(e) => setUnmatched(e.target.value)}
              note={<Err text={show(priceError(unmatched), 'tubes.unmatched')} />}
            />
            <TextField
              id="price-matched"
              label="Tube, sections matched by the supplier"
              numeric
              inputMode="decimal"
              value={matched}
              onChange={(e) => setMatched(e.target.value)}
              note={<Err text={show(priceError(matched), 'tubes.matched')} />}
            />
            <TextField
              id="price-currency"
              label="Currency"
              maxLength={8}
              value={currency}
              onChange={(e) => setCurrency(e.target.value)}
              note={
                <Err text={show(currency.trim() === '' ? 'A currency code, e.g. EUR' : null, 'currency')} />
              }
            />
          </div>
        </Panel>
        <div className="flex items-center gap-3">
          <Button type="submit" tone="primary" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : 'Save prices'}
          </Button>
          {save.isSuccess && <span className="text-sm text-moss">Saved.</span>}
        </div>
        {save.isError && !namesField(save.error, ['resistors', 'tubes', 'currency']) && (
          <ErrorNote error={save.error} />
        )}
      </fieldset>
    </form>
  );
}

function Err({ text }: { text: string | null | false }) {
  return text ? <p className="mt-0.5 text-xs text-brick">{text}</p> : null;
}
