import { sql, type Kysely } from 'kysely';

/*
 * Counters for the sign-in, reset and invite rate limits, shared by every server process (a
 * per-process memory store would give each process its own allowance). One row per key, e.g.
 * 'login:acct:<email>|<ip>', counting hits in a fixed window that starts at window_start.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('auth_throttle')
    .addColumn('key', 'text', (c) => c.primaryKey())
    .addColumn('hits', 'integer', (c) => c.notNull())
    .addColumn('window_start', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex('auth_throttle_window_idx')
    .on('auth_throttle')
    .column('window_start')
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('auth_throttle').execute();
}
