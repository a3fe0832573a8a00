// PostgreSQL error classes 08 (connection exception), 53300 (too many connections), 57P01-57P03
// (admin shutdown, crash shutdown, cannot connect now): PostgreSQL 15 documentation, appendix A.
const PG_CODES = new Set(['08000', '08001', '08003', '08004', '08006', '53300', '57P01', '57P02', '57P03']);
const NET_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'EPIPE',
  'ENOTFOUND',
  'EAI_AGAIN',
]);
// node-postgres's own wording for a pool connect timeout, a query timeout and a dropped connection.
const PG_CLIENT_MESSAGES = [
  'timeout exceeded when trying to connect',
  'Query read timeout',
  'Connection terminated',
  'Client has encountered a connection error',
];

/** True for errors that mean "the database cannot be reached right now" (answered 503, not 500). */
export function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: unknown; message?: unknown; errors?: unknown[] } | null;
  if (!e || typeof e !== 'object') return false;
  if (typeof e.code === 'string' && (PG_CODES.has(e.code) || NET_CODES.has(e.code))) return true;
  if (typeof e.message === 'string' && PG_CLIENT_MESSAGES.some((m) => (e.message as string).includes(m))) {
    return true;
  }
  // Node reports a refused dual-stack connect as an AggregateError of the per-address errors.
  return Array.isArray(e.errors) && e.errors.some(isDatabaseUnavailable);
}
