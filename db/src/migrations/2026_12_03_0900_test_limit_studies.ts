import { sql, type Kysely } from 'kysely';

/* Saved studies may also be test limits (a guard band chosen for a design's metric, for its report). */
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`alter table production_studies drop constraint production_studies_kind_check`.execute(db);
  await sql`alter table production_studies add constraint production_studies_kind_check
    check (kind in ('pairing','ageing','limits'))`.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`delete from production_studies where kind = 'limits'`.execute(db);
  await sql`alter table production_studies drop constraint production_studies_kind_check`.execute(db);
  await sql`alter table production_studies add constraint production_studies_kind_check
    check (kind in ('pairing','ageing'))`.execute(db);
}
