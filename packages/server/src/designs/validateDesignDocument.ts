import { parseDesign, type ResolvedDesign } from '@sigmatail/engine';
import { HttpError } from '../http/httpError.js';

/**
 * A design document checked with the engine's parseDesign (the same check the web editor runs).
 * Throws 400 naming the first bad field as `document.<path>`, with every issue listed.
 */
export function validateDesignDocument(document: unknown): ResolvedDesign {
  if (document === undefined) throw new HttpError(400, 'document: is required', 'document');
  const result = parseDesign(document);
  if (result.ok) return result.design;
  const issues = result.errors.map((e) => ({ path: `document.${e.path}`, message: e.message }));
  const first = issues[0]!;
  throw new HttpError(400, `${first.path}: ${first.message}`, first.path, issues);
}
