import type { ComponentProps, ReactNode } from 'react';
import { Field } from './Field.js';
import { inputClass } from './ui.js';

type InputProps = Omit<ComponentProps<'input'>, 'id' | 'className' | 'children'>;

/**
 * A labelled text input. Every other input attribute (type, value/onChange, a react-hook-form
 * `register(...)` spread, …) goes to the <input>; `numeric` sets it in the figures' face, `note` stands
 * under it (an error message, for instance) and `className` is the wrapper's (grid placement).
 */
export function TextField({
  id,
  label,
  className,
  numeric = false,
  note,
  ...input
}: InputProps & {
  id: string;
  label: ReactNode;
  className?: string;
  numeric?: boolean;
  note?: ReactNode;
}) {
  return (
    <Field id={id} label={label} className={className}>
      <input id={id} className={numeric ? `${inputClass} num` : inputClass} {...input} />
      {note}
    </Field>
  );
}
