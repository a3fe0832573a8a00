import { useFormContext } from 'react-hook-form';
import {
  CAPACITOR_PARTS,
  letterForTolerance,
  parseValue,
  TOLERANCE_LETTERS,
  type Design,
  type PartName,
} from '@sigmatail/engine';
import { formatSi } from '../format/formatSi.js';
import { cellBox, cellInput, FieldError, optionalNumber } from './formHelpers.js';
import { ResistorKindSelect, type ResistorName } from './ResistorKindSelect.js';

const SPREADS = [
  ['normal', 'Normal'],
  ['truncnormal', 'Normal, cut'],
  ['uniform', 'Uniform'],
  ['lognormal', 'Log-normal'],
  ['binned', 'Binned'],
  ['empirical', 'Measured lot'],
  ['fixed', 'Fixed'],
] as const;

const toValues = (kind: 'resistance' | 'capacitance') => ({
  setValueAs: (v: unknown) =>
    Array.isArray(v)
      ? v
      : String(v ?? '')
          .split(/[\s,;]+/)
          .filter(Boolean)
          .map((t) => {
            const r = parseValue(t, kind);
            return r.ok ? r.value : Number.NaN;
          }),
});

/**
 * One row of the parts table: value (RKM or engineering), tolerance letter and percent, a
 * resistor's kind, spread.
 */
export function PartRow({ name, label }: { name: PartName; label: string }) {
  const {
    register,
    watch,
    setValue,
    formState: { errors },
  } = useFormContext<Design>();
  const part = watch(`parts.${name}`);
  if (!part) return null;
  const valueKind = (CAPACITOR_PARTS as readonly string[]).includes(name) ? 'capacitance' : 'resistance';
  const kind = part.spread?.kind;
  const err = errors.parts?.[name];
  const parsed =
    typeof part.value === 'number'
      ? { ok: true as const, value: part.value }
      : parseValue(String(part.value ?? ''), valueKind);
  const letter = letterForTolerance(Number(part.tolerance)) ?? '';
  // "Cout1 (output 1 coupling)": the role goes on a small second line, so the column stays narrow.
  const [short, role] = label.split(/ \((.*)\)$/);
  return (
    <tr className="border-b border-rule/60 align-top">
      <th scope="row" className="py-1.5 pr-2 text-left text-sm font-medium">
        {short}
        {role && <span className="block text-[11px] leading-tight font-normal text-dim">{role}</span>}
      </th>
      <td className="pr-2">
        <input
          aria-label={`${label} value`}
          className={`${cellInput} num min-w-[4.5rem]`}
          {...register(`parts.${name}.value`)}
        />
        <p className="num mt-0.5 text-[11px] text-dim">
          {parsed.ok ? formatSi(parsed.value, valueKind === 'capacitance' ? 'F' : 'Ω', 4) : ''}
        </p>
        <FieldError error={err?.value} />
      </td>
      <td className="pr-2">
        <div className="flex gap-1">
          <select
            aria-label={`${label} tolerance class`}
            className={`${cellBox} w-[6.25rem]`}
            value={letter}
            onChange={(e) => {
              const l = e.target.value as keyof typeof TOLERANCE_LETTERS;
              if (l)
                setValue(`parts.${name}.tolerance`, TOLERANCE_LETTERS[l], {
                  shouldDirty: true,
                  shouldValidate: true,
                });
            }}
          >
            <option value="">–</option>
            {Object.entries(TOLERANCE_LETTERS).map(([l, t]) => (
              <option key={l} value={l}>
                {l} ±{t}%
              </option>
            ))}
          </select>
          <input
            aria-label={`${label} tolerance percent`}
            type="number"
            step="any"
            className={`${cellBox} num w-[4.25rem]`}
            {...register(`parts.${name}.tolerance`, optionalNumber)}
          />
        </div>
        <FieldError error={err?.tolerance} />
      </td>
      <td className="pr-2">
        {valueKind === 'resistance' && <ResistorKindSelect name={name as ResistorName} label={label} />}
      </td>
      <td className="pr-2">
        <select
          aria-label={`${label} spread`}
          title="Normal: tolerance = k·σ. Normal, cut: truncated at ±tolerance. Binned: parts within ±inner % were sorted out. Measured lot: measured values, resampled."
          className={`${cellBox} w-[7.5rem]`}
          {...register(`parts.${name}.spread.kind`)}
        >
          {SPREADS.map(([k, text]) => (
            <option key={k} value={k}>
              {text}
            </option>
          ))}
        </select>
      </td>
      <td>
        <div className="flex flex-wrap gap-1">
          {(kind === 'normal' || kind === 'truncnormal' || kind === 'lognormal' || kind === 'binned') && (
            <input
              aria-label={`${label} k (tolerance in σ)`}
              title="k: tolerance = k·σ (default 3)"
              placeholder="k = 3"
              type="number"
              step="any"
              className={`${cellBox} num w-20`}
              {...register(`parts.${name}.spread.k`, optionalNumber)}
            />
          )}
          {kind === 'binned' && (
            <input
              aria-label={`${label} inner gap percent`}
              title="Parts within ± this % were sorted out"
              placeholder="inner %"
              type="number"
              step="any"
              className={`${cellBox} num w-20`}
              {...register(`parts.${name}.spread.inner`, optionalNumber)}
            />
          )}
          {kind === 'empirical' && part.spread.kind === 'empirical' && part.spread.lot && (
            <span className="text-xs text-dim" title="Values embedded from this lot">
              lot: {part.spread.lot.name} ({part.spread.values.length})
            </span>
          )}
          {kind === 'empirical' && (
            <input
              aria-label={`${label} measured values`}
              placeholder="99.2k, 100.4k, …"
              className={`${cellInput} num`}
              {...register(`parts.${name}.spread.values`, toValues(valueKind))}
            />
          )}
        </div>
        <FieldError
          error={(err?.spread as { k?: { message?: string }; inner?: { message?: string } } | undefined)?.k}
        />
        <FieldError error={(err?.spread as { inner?: { message?: string } } | undefined)?.inner} />
      </td>
    </tr>
  );
}
