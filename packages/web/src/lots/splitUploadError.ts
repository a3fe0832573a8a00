import type { ApiError } from '../api/client.js';

/** A refused file's problems, one per CSV row and column. */
export type RowError = { row: number; column: string; message: string };

/**
 * Splits an upload's error into row errors (issue paths `rows.<line>.<column>`) and one message
 * per form field (error.field), so the form shows each where it belongs.
 *
 * @example splitUploadError(err).rows // [{ row: 3, column: 'value', message: 'not a resistance…' }]
 */
export function splitUploadError(err: ApiError): { rows: RowError[]; fields: Record<string, string> } {
  const rows: RowError[] = [];
  for (const i of err.issues ?? []) {
    const m = /^rows\.(\d+)\.(.*)$/.exec(i.path);
    if (m) rows.push({ row: Number(m[1]), column: m[2] ?? '', message: i.message });
  }
  const fields: Record<string, string> = {};
  if (err.field) fields[err.field] = err.message.replace(new RegExp(`^${err.field}: `), '');
  return { rows, fields };
}
