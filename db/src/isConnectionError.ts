// SQLSTATE classes and socket errors that mean "the database is out of reach", not "this query is wrong".
const CODES = new Set([
  '57P01', // admin_shutdown
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now (starting up)
  '08000', // connection_exception
  '08001',
  '08003',
  '08004',
  '08006',
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
]);
const MESSAGES =
  /connection terminated|terminating connection|ECONNREFUSED|ECONNRESET|the database system is (starting|shutting)|timeout exceeded when trying to connect|Connection terminated unexpectedly/i;

/**
 * True when `err` says the database could not be reached (outage, restart, refused or dropped
 * connection) rather than that a statement failed. Errors crossing a worker-thread boundary keep
 * only their message, so the message is checked as well as the code.
 */
export function isConnectionError(err: unknown): boolean {
  if (!(err instanceof Error)) return false;
  const code = (err as { code?: unknown }).code;
  return (typeof code === 'string' && CODES.has(code)) || MESSAGES.test(err.message);
}
