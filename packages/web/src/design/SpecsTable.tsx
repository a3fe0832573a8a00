import { useFieldArray, useFormContext } from 'react-hook-form';
import { AC_METRIC_IDS, AC_METRICS, CORNER_METRICS, METRICS, type Design } from '@sigmatail/engine';
import { Button } from '../components/ui.js';
import { cellInput, FieldError, optionalNumber } from './formHelpers.js';
import { Table } from '../components/Table.js';

const CHOOSABLE = [
  ...METRICS.filter((m) => m.id !== 'valid'),
  ...CORNER_METRICS,
  ...AC_METRICS.map((m) => ({ ...m, label: `${m.label} at…` })),
];
const isAc = (id: string | undefined) => (AC_METRIC_IDS as readonly (string | undefined)[]).includes(id);

/** Limits on metrics; a run's yield counts the samples inside every one of them. */
export function SpecsTable({ readOnly }: { readOnly: boolean }) {
  const {
    control,
    register,
    watch,
    setValue,
    formState: { errors },
  } = useFormContext<Design>();
  const { fields, append, remove } = useFieldArray({ control, name: 'specs' });
  const specs = watch('specs');
  return (
    <div>
      <Table
        className="w-full"
        head={
          <>
            <th className="py-1.5 font-medium">Metric</th>
            <th className="font-medium">Frequency (Hz)</th>
            <th className="font-medium">Min</th>
            <th className="font-medium">Max</th>
            <th className="font-medium">Label</th>
            <th className="sr-only">Remove</th>
          </>
        }
      >
        {fields.map((f, i) => {
          const metric = specs?.[i]?.metric;
          const unit = CHOOSABLE.find((m) => m.id === metric)?.unit ?? '';
          const err = errors.specs?.[i];
          return (
            <tr key={f.id} className="border-b border-rule/60 align-top">
              <td className="py-1.5 pr-2">
                <select
                  aria-label={`Spec ${i + 1} metric`}
                  className={cellInput}
                  {...register(`specs.${i}.metric`, {
                    // A frequency metric needs a frequency (20 kHz to start with); others take none.
                    onChange: (e: { target: { value: string } }) =>
                      setValue(`specs.${i}.frequency`, isAc(e.target.value) ? 20000 : undefined, {
                        shouldValidate: true,
                      }),
                  })}
                >
                  {CHOOSABLE.map((m) => (
                    <option key={m.id} value={m.id}>
                      {m.label}
                      {m.unit ? ` (${m.unit})` : ''}
                    </option>
                  ))}
                </select>
              </td>
              <td className="pr-2">
                {isAc(metric) && (
                  <input
                    aria-label={`Spec ${i + 1} frequency Hz`}
                    type="number"
                    step="any"
                    className={`${cellInput} num w-24`}
                    {...register(`specs.${i}.frequency`, optionalNumber)}
                  />
                )}
                <FieldError error={err?.frequency} />
              </td>
              <td className="pr-2">
                <input
                  aria-label={`Spec ${i + 1} min ${unit}`}
                  type="number"
                  step="any"
                  className={`${cellInput} num w-24`}
                  {...register(`specs.${i}.min`, optionalNumber)}
                />
                <FieldError error={err?.min} />
              </td>
              <td className="pr-2">
                <input
                  aria-label={`Spec ${i + 1} max ${unit}`}
                  type="number"
                  step="any"
                  className={`${cellInput} num w-24`}
                  {...register(`specs.${i}.max`, optionalNumber)}
                />
                <FieldError error={err?.max} />
              </td>
              <td className="pr-2">
                <input
                  aria-label={`Spec ${i + 1} label`}
                  className={cellInput}
                  {...register(`specs.${i}.label`)}
                />
              </td>
              <td>
                {!readOnly && (
                  <Button tone="danger" onClick={() => remove(i)} aria-label={`Remove spec ${i + 1}`}>
                    ✕
                  </Button>
                )}
              </td>
            </tr>
          );
        })}
      </Table>
      {fields.length === 0 && (
        <p className="py-2 text-sm text-dim">No specs: runs will report distributions but no yield.</p>
      )}
      {!readOnly && (
        <Button
          className="mt-2"
          onClick={() => append({ metric: 'gainDiff', min: undefined, max: undefined, label: '' })}
        >
          Add spec
        </Button>
      )}
    </div>
  );
}
