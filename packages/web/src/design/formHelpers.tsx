import type { FieldError as RhfFieldError } from 'react-hook-form';

/** Number inputs: empty text is "not given" (undefined), anything else a number for zod to judge. */
export const optionalNumber = {
  setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v)),
};

/** The message of a react-hook-form/zod error, under its field. */
export function FieldError({ error }: { error?: RhfFieldError | { message?: string } }) {
  if (!error?.message) return null;
  return <p className="mt-0.5 text-xs text-brick">{error.message}</p>;
}

/** A table cell's input without a width, for controls given a fixed one (`${cellBox} w-20`). */
export const cellBox =
  'rounded border border-rule bg-white px-2 py-1 text-sm text-ink focus:border-glow focus:outline-none disabled:bg-paper disabled:text-dim';

/** A table cell's input filling its cell (a width added after it loses to `w-full`; use {@link cellBox}). */
export const cellInput = `w-full ${cellBox}`;
