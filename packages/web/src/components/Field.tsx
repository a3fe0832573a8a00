import type { ReactNode } from 'react';
import { labelClass } from './ui.js';

/**
 * A form control under its label. `children` is the control, with any note or error message that
 * belongs under it; `id` must be the control's id so the label focuses it.
 */
export function Field({
  id,
  label,
  className,
  children,
}: {
  id: string;
  label: ReactNode;
  className?: string;
  children: ReactNode;
}) {
  return (
    <div className={className}>
      <label htmlFor={id} className={labelClass}>
        {label}
      </label>
      {children}
    </div>
  );
}
