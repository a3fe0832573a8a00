import { sql, type Kysely } from 'kysely';

// Migrations take Kysely<any>: they describe the schema at one point in time, not today's Database type.
/* eslint-disable @typescript-eslint/no-explicit-any */

const ROLE_CHECK = sql`check (role in ('admin', 'engineer', 'production', 'viewer'))`;

export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('workspaces')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('settings', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('users')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('email', 'text', (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text', (c) => c.notNull())
    .addColumn('session_epoch', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('users_email_lower', sql`email = lower(email)`)
    .execute();

  await db.schema
    .createTable('memberships')
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('workspace_id', 'uuid', (c) => c.notNull().references('workspaces.id').onDelete('cascade'))
    .addColumn('role', 'text', (c) => c.notNull().modifyEnd(ROLE_CHECK))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('memberships_pk', ['user_id', 'workspace_id'])
    .execute();
  await db.schema.createIndex('memberships_workspace').on('memberships').column('workspace_id').execute();

  await db.schema
    .createTable('invites')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('workspace_id', 'uuid', (c) => c.notNull().references('workspaces.id').onDelete('cascade'))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull().modifyEnd(ROLE_CHECK))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('invited_by', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('accepted_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('invites_workspace').on('invites').column('workspace_id').execute();

  await db.schema
    .createTable('password_resets')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('used_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('designs')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('workspace_id', 'uuid', (c) => c.notNull().references('workspaces.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('latest_rev', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('archived_at', 'timestamptz')
    .execute();
  await db.schema
    .createIndex('designs_workspace')
    .on('designs')
    .columns(['workspace_id', 'updated_at'])
    .execute();

  await db.schema
    .createTable('design_revisions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('design_id', 'uuid', (c) => c.notNull().references('designs.id').onDelete('cascade'))
    .addColumn('rev', 'integer', (c) => c.notNull())
    .addColumn('document', 'jsonb', (c) => c.notNull())
    .addColumn('message', 'text')
    .addColumn('created_by', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint('design_revisions_design_rev', ['design_id', 'rev'])
    .execute();
  // A revision is a record of what was saved; runs point at it, so it must never change.
  await sql`
    create function design_revisions_immutable() returns trigger language plpgsql as $$
    begin
      raise exception 'design revisions are immutable';
    end $$`.execute(db);
  await sql`
    create trigger design_revisions_no_update before update on design_revisions
    for each row execute function design_revisions_immutable()`.execute(db);

  await db.schema
    .createTable('dev_mail')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('mail_from', 'text', (c) => c.notNull())
    .addColumn('mail_to', 'text', (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('html', 'text')
    .addColumn('received_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('dev_mail_to').on('dev_mail').columns(['mail_to', 'received_at']).execute();

  await db.schema
    .createTable('audit_events')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('workspace_id', 'uuid', (c) => c.references('workspaces.id').onDelete('cascade'))
    .addColumn('user_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('target', 'text')
    .addColumn('detail', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex('audit_events_workspace_at')
    .on('audit_events')
    .columns(['workspace_id', 'at'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('audit_events').execute();
  await db.schema.dropTable('dev_mail').execute();
  await db.schema.dropTable('design_revisions').execute();
  await sql`drop function design_revisions_immutable()`.execute(db);
  await db.schema.dropTable('designs').execute();
  await db.schema.dropTable('password_resets').execute();
  await db.schema.dropTable('invites').execute();
  await db.schema.dropTable('memberships').execute();
  await db.schema.dropTable('users').execute();
  await db.schema.dropTable('workspaces').execute();
}
