import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import { closeListeners, registerDatabaseUrl } from './notificationListener.js';
import type { Database } from './schema.js';

/**
 * A Kysely handle on the application database.
 * @param url postgres://user@host:port/dbname
 * @param options.max pool size (default 10)
 * @param options.connectionTimeoutMillis how long to wait for a connection before failing (ms, default 2000)
 * @param options.statementTimeoutMillis longest a statement may run on the server (ms, default 0 = no limit)
 * @param options.queryTimeoutMillis longest the client waits for any answer, e.g. from a database
 *   that stopped answering on an open connection (ms, default 0 = no limit)
 */
export function createDb(
  url: string,
  options: {
    max?: number;
    connectionTimeoutMillis?: number;
    statementTimeoutMillis?: number;
    queryTimeoutMillis?: number;
  } = {},
): Kysely<Database> {
  const pool = new pg.Pool({
    connectionString: url,
    max: options.max ?? 10,
    // A database that does not answer must fail a request quickly (503), not hang it.
    connectionTimeoutMillis: options.connectionTimeoutMillis ?? 2_000,
    ...(options.statementTimeoutMillis ? { statement_timeout: options.statementTimeoutMillis } : {}),
    ...(options.queryTimeoutMillis ? { query_timeout: options.queryTimeoutMillis } : {}),
  });
  // A client that loses its server (restart, outage) must not crash the process: idle clients
  // report through the pool, clients checked out (e.g. inside a transaction) through their own
  // listener; the query in flight fails and the pool connects afresh next time.
  pool.on('error', (err) => console.error('postgres pool error:', err.message));
  pool.on('connect', (client) => {
    client.on('error', (err) => console.error('postgres connection error:', err.message));
  });
  const end = pool.end.bind(pool);
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  // db.destroy() ends the pool; the LISTEN connections of this handle go with it.
  pool.end = (async () => {
    await closeListeners(db);
    await end();
  }) as typeof pool.end;
  registerDatabaseUrl(db, url);
  return db;
}
