import { sql, type Kysely } from 'kysely';

/*
 * One row per signed-in session. The session token carries the row's id (sid), and resolving a
 * token reads the row in the same query as the user and membership, so signing out (revoked_at
 * set) refuses the old cookie on the very next request, in every server process.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('sessions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('revoked_at', 'timestamptz')
    .execute();
  await db.schema.createIndex('sessions_user_idx').on('sessions').column('user_id').execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('sessions').execute();
}
