import { ApiError } from '../api/client.js';

/**
 * The server's message for one form field (or any of its sub-fields), when the failed request
 * named it; null otherwise.
 *
 * @example fieldError(mutation.error, 'samples')
 */
export function fieldError(error: unknown, field: string): string | null {
  if (!(error instanceof ApiError)) return null;
  const hit = error.issues?.find((i) => i.path === field || i.path.startsWith(`${field}.`));
  if (hit) return hit.message;
  if (error.field === field || error.field?.startsWith(`${field}.`)) return error.message;
  return null;
}

/** Whether the failed request named one of these form fields (so the form shows it there). */
export function namesField(error: unknown, fields: readonly string[]): boolean {
  return fields.some((f) => fieldError(error, f) !== null);
}
