import { sql, type Kysely } from 'kysely';

/*
 * Runs, their chunks and their stored results.
 *
 * The queue is the run_chunks table itself (claimed with FOR UPDATE SKIP LOCKED and a lease),
 * not pg-boss: a chunk's queue entry and its stored result are the same row, so "a chunk
 * delivered twice is harmless" is one conditional UPDATE, progress is a counter on the run
 * row, and exactly one worker wins the merge by the row lock on that counter. A crashed
 * worker's chunks come back when their lease expires. Nothing lives outside PostgreSQL.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable('runs')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('workspace_id', 'uuid', (c) => c.notNull().references('workspaces.id').onDelete('cascade'))
    .addColumn('design_id', 'uuid', (c) => c.notNull().references('designs.id').onDelete('cascade'))
    .addColumn('revision', 'integer', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('status', 'text', (c) =>
      c
        .notNull()
        .defaultTo('queued')
        .check(sql`status in ('queued','running','merging','done','failed','cancelled')`),
    )
    .addColumn('samples', 'integer', (c) => c.notNull().check(sql`samples between 1 and 100000000`))
    .addColumn('seed', 'text', (c) => c.notNull())
    .addColumn('plan', 'text', (c) => c.notNull().check(sql`plan in ('random','lhs','sobol')`))
    .addColumn('chunk_size', 'integer', (c) => c.notNull())
    .addColumn('analyses', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('design', 'jsonb', (c) => c.notNull())
    .addColumn('engine_version', 'text', (c) => c.notNull())
    .addColumn('chunk_total', 'integer', (c) => c.notNull())
    .addColumn('chunks_done', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('error', 'text')
    .addColumn('merge_owner', 'text')
    .addColumn('merge_lease_until', 'timestamptz')
    .addColumn('notify_state', 'text', (c) => c.check(sql`notify_state in ('pending','sent')`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('started_at', 'timestamptz')
    .addColumn('finished_at', 'timestamptz')
    .execute();
  await db.schema
    .createIndex('runs_workspace_created')
    .on('runs')
    .columns(['workspace_id', 'created_at'])
    .execute();
  await db.schema.createIndex('runs_design').on('runs').columns(['design_id', 'created_at']).execute();
  await db.schema
    .createIndex('runs_active')
    .on('runs')
    .columns(['status', 'created_at'])
    .where(sql.ref('status'), 'in', ['queued', 'running', 'merging'])
    .execute();
  await db.schema
    .createIndex('runs_notify_pending')
    .on('runs')
    .column('id')
    .where(sql.ref('notify_state'), '=', 'pending')
    .execute();

  await db.schema
    .createTable('run_chunks')
    .addColumn('run_id', 'uuid', (c) => c.notNull().references('runs.id').onDelete('cascade'))
    .addColumn('chunk_index', 'integer', (c) => c.notNull())
    .addColumn('state', 'text', (c) =>
      c
        .notNull()
        .defaultTo('pending')
        .check(sql`state in ('pending','leased','done')`),
    )
    .addColumn('lease_owner', 'text')
    .addColumn('lease_until', 'timestamptz')
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    // json (not jsonb): stored verbatim, so numbers come back with exactly the digits written.
    .addColumn('result', 'json')
    .addColumn('done_at', 'timestamptz')
    .addPrimaryKeyConstraint('run_chunks_pk', ['run_id', 'chunk_index'])
    .execute();
  await db.schema
    .createIndex('run_chunks_open')
    .on('run_chunks')
    .columns(['run_id', 'chunk_index'])
    .where(sql.ref('state'), '<>', 'done')
    .execute();

  await db.schema
    .createTable('run_results')
    .addColumn('run_id', 'uuid', (c) => c.primaryKey().references('runs.id').onDelete('cascade'))
    .addColumn('results', 'json', (c) => c.notNull())
    .addColumn('valid_count', 'double precision')
    .addColumn('joint_yield', 'double precision')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable('run_results').ifExists().execute();
  await db.schema.dropTable('run_chunks').ifExists().execute();
  await db.schema.dropTable('runs').ifExists().execute();
}
