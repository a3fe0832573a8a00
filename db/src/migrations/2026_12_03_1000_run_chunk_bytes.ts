import type { Kysely } from 'kysely';

/*
 * Chunk results as bytes (the engine's binary chunk layout) beside the JSON column: a worker's
 * pool thread hands them over without a copy and nobody writes or parses ~100 kB of JSON per
 * chunk. `result` stays for the once-per-run parts and for chunks stored before this change.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('run_chunks').addColumn('result_bin', 'bytea').execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable('run_chunks').dropColumn('result_bin').execute();
}
