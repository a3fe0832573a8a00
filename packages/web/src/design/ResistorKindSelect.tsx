import { useFormContext } from 'react-hook-form';
import {
  DEFAULT_RESISTOR_KIND,
  RESISTOR_KINDS,
  type Design,
  type ResistorKind,
  type RESISTOR_PARTS,
} from '@sigmatail/engine';
import { KIND_LABELS } from '../production/kindLabels.js';
import { cellBox } from './formHelpers.js';

/** Part names that are resistors. */
export type ResistorName = (typeof RESISTOR_PARTS)[number];

/**
 * The construction of one resistor part (prices, pairing cost, ageing drift). The default kind is
 * left out of the document, so a document that never named a kind saves as it was.
 */
export function ResistorKindSelect({ name, label }: { name: ResistorName; label: string }) {
  const { watch, setValue } = useFormContext<Design>();
  const kind = watch(`parts.${name}.kind`) ?? DEFAULT_RESISTOR_KIND;
  return (
    <select
      aria-label={`${label} kind`}
      title="Construction: sets the price of tolerance plans and pairing, and the ageing drift"
      className={`${cellBox} w-44`}
      value={kind}
      onChange={(e) => {
        const next = e.target.value as ResistorKind;
        setValue(`parts.${name}.kind`, next === DEFAULT_RESISTOR_KIND ? undefined : next, {
          shouldDirty: true,
          shouldValidate: true,
        });
      }}
    >
      {RESISTOR_KINDS.map((k) => (
        <option key={k} value={k}>
          {KIND_LABELS[k]}
        </option>
      ))}
    </select>
  );
}
