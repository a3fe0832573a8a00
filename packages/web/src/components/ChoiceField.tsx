import { Field } from './Field.js';
import { inputClass } from './ui.js';

/** A labelled drop-down over a fixed list of string choices, each shown as `labelOf(choice)` (default: itself). */
export function ChoiceField<T extends string>({
  id,
  label,
  value,
  choices,
  labelOf = (c) => c,
  onChange,
}: {
  id: string;
  label: string;
  value: T;
  choices: readonly T[];
  labelOf?: (choice: T) => string;
  onChange: (choice: T) => void;
}) {
  return (
    <Field id={id} label={label}>
      <select id={id} className={inputClass} value={value} onChange={(e) => onChange(e.target.value as T)}>
        {choices.map((c) => (
          <option key={c} value={c}>
            {labelOf(c)}
          </option>
        ))}
      </select>
    </Field>
  );
}
