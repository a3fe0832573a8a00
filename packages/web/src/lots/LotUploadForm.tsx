import { LOT_COLUMNS, MAX_LOT_BYTES, MAX_LOT_ROWS, TUBE_CATALOG, TUBE_TYPES } from '@sigmatail/engine';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router';
import { ApiError } from '../api/client.js';
import { lotQueries, lotsApi, type LotKind, type TubeQuantity } from '../api/lotsApi.js';
import { ChoiceField } from '../components/ChoiceField.js';
import { Field } from '../components/Field.js';
import { TextField } from '../components/TextField.js';
import { Button, inputClass } from '../components/ui.js';
import { RowErrorsTable } from './RowErrorsTable.js';
import { splitUploadError, type RowError } from './splitUploadError.js';

const KIND_LABEL: Record<LotKind, string> = {
  resistor: 'Resistors (one value per row)',
  tube: 'Tubes (two sections per row)',
};
const QUANTITY_LABEL: Record<TubeQuantity, string> = {
  'ia-gm': 'Ia (mA) and gm (mA/V) at a test point',
  'mu-rp': 'mu and rp (Ω)',
};
type TubeType = (typeof TUBE_TYPES)[number];

const fieldNote = (msg?: string) =>
  msg ? (
    <p className="mt-1 text-xs text-brick" role="alert">
      {msg}
    </p>
  ) : null;

/** Upload a lot: a CSV file, a name, its kind, and for tubes what was measured and where. */
export function LotUploadForm() {
  const qc = useQueryClient();
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const [kind, setKind] = useState<LotKind>('resistor');
  const [quantity, setQuantity] = useState<TubeQuantity>('ia-gm');
  const [tubeType, setTubeType] = useState<TubeType>('12AX7');
  const [va, setVa] = useState('');
  const [vg, setVg] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [rows, setRows] = useState<RowError[]>([]);
  const upload = useMutation({
    mutationFn: lotsApi.upload,
    onSuccess: async ({ lot }) => {
      await qc.invalidateQueries({ queryKey: lotQueries.all });
      void navigate(`/production/lots/${lot.id}`);
    },
    onError: (err) => {
      if (!(err instanceof ApiError)) return setFields({ form: String(err) });
      const split = splitUploadError(err);
      setRows(split.rows);
      setFields(Object.keys(split.fields).length > 0 ? split.fields : { form: err.message });
    },
  });
  const typical = TUBE_CATALOG[tubeType].typical;

  function submit(e: FormEvent) {
    e.preventDefault();
    const problems: Record<string, string> = {};
    if (!name.trim()) problems.name = 'Give the lot a name.';
    if (!file) problems.file = 'Choose a CSV file.';
    else if (file.size > MAX_LOT_BYTES)
      problems.file = `The file is larger than ${MAX_LOT_BYTES / 1024 / 1024} MiB.`;
    if (kind === 'tube' && va !== '' && !(Number(va) > 0))
      problems.va = 'Plate volts must be a number above 0.';
    if (kind === 'tube' && vg !== '' && !(Number(vg) <= 0))
      problems.vg = 'Grid volts must be a number, 0 or below.';
    setFields(problems);
    setRows([]);
    if (Object.keys(problems).length > 0 || !file) return;
    upload.mutate({ name: name.trim(), kind, quantity, tubeType, va, vg, file });
  }

  const columns = kind === 'resistor' ? LOT_COLUMNS.resistor : LOT_COLUMNS[quantity];
  return (
    <form onSubmit={submit} noValidate aria-label="Upload a lot" className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          id="lot-name"
          label="Lot name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          note={fieldNote(fields.name)}
        />
        <div>
          <ChoiceField
            id="lot-kind"
            label="Kind"
            value={kind}
            choices={['resistor', 'tube'] as const}
            labelOf={(k) => KIND_LABEL[k]}
            onChange={setKind}
          />
          {fieldNote(fields.kind)}
        </div>
        {kind === 'tube' && (
          <>
            <div>
              <ChoiceField
                id="lot-quantity"
                label="Measured per section"
                value={quantity}
                choices={['ia-gm', 'mu-rp'] as const}
                labelOf={(q) => QUANTITY_LABEL[q]}
                onChange={setQuantity}
              />
              {fieldNote(fields.quantity)}
            </div>
            <div>
              <ChoiceField
                id="lot-tube"
                label="Tube type"
                value={tubeType}
                choices={TUBE_TYPES}
                onChange={setTubeType}
              />
              {fieldNote(fields.tubeType)}
            </div>
            <TextField
              id="lot-va"
              label="Test point plate volts (V)"
              numeric
              inputMode="decimal"
              placeholder={String(typical.va)}
              value={va}
              onChange={(e) => setVa(e.target.value)}
              note={fieldNote(fields.va)}
            />
            <TextField
              id="lot-vg"
              label="Test point grid volts (V)"
              numeric
              inputMode="decimal"
              placeholder={String(typical.vg)}
              value={vg}
              onChange={(e) => setVg(e.target.value)}
              note={fieldNote(fields.vg)}
            />
          </>
        )}
      </div>
      <Field id="lot-file" label="CSV file">
        <input
          id="lot-file"
          type="file"
          accept=".csv,text/csv"
          className={inputClass}
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
        />
        {fieldNote(fields.file)}
      </Field>
      <p className="text-xs text-dim">
        Header row with <span className="font-mono">{columns.join(', ')}</span> (other columns are ignored);
        at most {MAX_LOT_ROWS.toLocaleString('en')} rows.{' '}
        {kind === 'resistor'
          ? 'Values in ohms; RKM codes like 4k7 are fine.'
          : 'Empty test point: the datasheet typical point.'}
      </p>
      {fieldNote(fields.form)}
      <Button tone="primary" type="submit" disabled={upload.isPending}>
        {upload.isPending ? 'Uploading…' : 'Upload lot'}
      </Button>
      {rows.length > 0 && <RowErrorsTable rows={rows} />}
    </form>
  );
}
