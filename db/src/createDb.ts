import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { Database } from './schema.js';

/**
 * A Kysely handle on the application database.
 * @param url postgres://user@host:port/dbname
 * @param options.max pool size (default 10)
 */
export function createDb(url: string, options: { max?: number } = {}): Kysely<Database> {
  const pool = new pg.Pool({ connectionString: url, max: options.max ?? 10 });
  // A client that loses its server (restart, outage) must not crash the process: idle clients
  // report through the pool, clients checked out (e.g. inside a transaction) through their own
  // listener; the query in flight fails and the pool connects afresh next time.
  pool.on('error', (err) => console.error('postgres pool error:', err.message));
  pool.on('connect', (client) => {
    client.on('error', (err) => console.error('postgres connection error:', err.message));
  });
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}
