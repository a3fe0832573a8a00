import type { Request } from 'express';
import { HttpError } from './httpError.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * A route parameter that must be a uuid. A malformed id can name no row, so it is a 404
 * (the same answer as an unknown id), and it never reaches PostgreSQL (which would raise 22P02).
 */
export function uuidParam(req: Request, name: string, what: string): string {
  const value = req.params[name];
  if (typeof value !== 'string' || !UUID.test(value)) throw new HttpError(404, `${what} not found`);
  return value.toLowerCase();
}

export function isUuid(value: string): boolean {
  return UUID.test(value);
}
