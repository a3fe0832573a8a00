import type { ComponentProps, ReactNode } from 'react';
import { useFormContext, type FieldPath } from 'react-hook-form';
import type { Design } from '@sigmatail/engine';
import { TextField } from '../components/TextField.js';
import { FieldError, optionalNumber } from './formHelpers.js';

/**
 * A labelled number input of the design form, registered under `name` (empty text is "not given"),
 * with its validation message under it. `step` is "any" unless given.
 */
export function NumberField({
  id,
  label,
  name,
  error,
  className,
  step = 'any',
  min,
  max,
  placeholder,
}: {
  id: string;
  label: ReactNode;
  name: FieldPath<Design>;
  error?: ComponentProps<typeof FieldError>['error'];
  className?: string;
  step?: string;
  min?: number;
  max?: number;
  placeholder?: string;
}) {
  const { register } = useFormContext<Design>();
  return (
    <TextField
      id={id}
      label={label}
      className={className}
      numeric
      type="number"
      step={step}
      min={min}
      max={max}
      placeholder={placeholder}
      {...register(name, optionalNumber)}
      note={<FieldError error={error} />}
    />
  );
}
