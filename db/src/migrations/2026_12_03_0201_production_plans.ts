import { sql, type Kysely } from 'kysely';

/*
 * Production planning: the workspace price table, saved tolerance plans (design revision, target,
 * frontier, chosen assignment, confirming run) and saved pairing comparisons and ageing results.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('price_tables')
    .addColumn('workspace_id', 'uuid', (c) => c.primaryKey().references('workspaces.id').onDelete('cascade'))
    .addColumn('prices', 'jsonb', (c) => c.notNull())
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createTable('production_plans')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('workspace_id', 'uuid', (c) => c.notNull().references('workspaces.id').onDelete('cascade'))
    .addColumn('design_id', 'uuid', (c) => c.notNull().references('designs.id').onDelete('cascade'))
    .addColumn('revision', 'integer', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('target', 'jsonb', (c) => c.notNull())
    .addColumn('result', 'jsonb', (c) => c.notNull())
    .addColumn('assignment', 'jsonb')
    .addColumn('confirm_revision', 'integer')
    .addColumn('confirm_run_id', 'uuid', (c) => c.references('runs.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex('production_plans_design')
    .on('production_plans')
    .columns(['workspace_id', 'design_id', 'created_at'])
    .execute();
  await db.schema
    .createTable('production_studies')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('workspace_id', 'uuid', (c) => c.notNull().references('workspaces.id').onDelete('cascade'))
    .addColumn('design_id', 'uuid', (c) => c.notNull().references('designs.id').onDelete('cascade'))
    .addColumn('revision', 'integer', (c) => c.notNull())
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('pairing','ageing')`))
    .addColumn('created_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('input', 'jsonb', (c) => c.notNull())
    .addColumn('result', 'jsonb', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex('production_studies_design')
    .on('production_studies')
    .columns(['workspace_id', 'design_id', 'kind', 'created_at'])
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('production_studies').execute();
  await db.schema.dropTable('production_plans').execute();
  await db.schema.dropTable('price_tables').execute();
}
