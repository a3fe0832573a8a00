import { ApiError } from '../api/client.js';

/** A quiet placeholder while data loads. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-2 py-6 text-sm text-dim">
      <span className="h-3 w-3 animate-pulse rounded-full bg-glow" aria-hidden="true" />
      {label}
    </div>
  );
}

/** A failed query or mutation, with the server's own message and a retry when one is possible. */
export function ErrorNote({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  const status = error instanceof ApiError ? error.status : undefined;
  return (
    <div
      role="alert"
      className="rounded-md border border-brick/40 bg-brick-soft px-4 py-3 text-sm text-brick"
    >
      <p>
        {status === 403 ? 'You do not have permission for this. ' : ''}
        {message}
      </p>
      {onRetry && (
        <button type="button" onClick={onRetry} className="mt-2 font-medium underline">
          Try again
        </button>
      )}
    </div>
  );
}

/** A query's loading placeholder (`label`) or its failure with a retry; nothing once it has data. */
export function QueryStatus({
  query,
  label,
}: {
  query: { isPending: boolean; isError: boolean; error: unknown; refetch: () => unknown };
  label?: string;
}) {
  return (
    <>
      {query.isPending && <Loading label={label} />}
      {query.isError && <ErrorNote error={query.error} onRetry={() => query.refetch()} />}
    </>
  );
}
