import { sql, type Kysely } from 'kysely';

/*
 * Measured lots: one row per uploaded CSV, its values kept as jsonb (a few thousand numbers at
 * most). Resistor lots keep one value per part (ohms); tube lots keep, per tube, the raw
 * section measurements and the model multipliers worked out from them at upload.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('lots')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('workspace_id', 'uuid', (c) => c.notNull().references('workspaces.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('resistor','tube')`))
    .addColumn('quantity', 'text', (c) => c.notNull().check(sql`quantity in ('ohms','ia-gm','mu-rp')`))
    .addColumn('tube_type', 'text')
    .addColumn('test_point', 'jsonb')
    .addColumn('file_name', 'text')
    .addColumn('count', 'integer', (c) => c.notNull().check(sql`count >= 1`))
    .addColumn('data', 'jsonb', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex('lots_workspace_created')
    .on('lots')
    .columns(['workspace_id', 'created_at'])
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('lots').ifExists().execute();
}
