import type { ReactNode } from 'react';
import { ErrorNote } from '../components/QueryState.js';
import { Button } from '../components/ui.js';

/**
 * The foot of a form on the signed-out pages: the failed request's message, if any, over the
 * full-width submit button, which is off while the request runs (or while `disabled`).
 */
export function AuthSubmit({
  mutation,
  disabled = false,
  children,
}: {
  mutation: { isError: boolean; isPending: boolean; error: unknown };
  disabled?: boolean;
  children: ReactNode;
}) {
  return (
    <>
      {mutation.isError && <ErrorNote error={mutation.error} />}
      <Button tone="primary" type="submit" disabled={mutation.isPending || disabled} className="w-full py-2">
        {children}
      </Button>
    </>
  );
}
