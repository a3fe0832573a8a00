import { Migrator, type Kysely, type MigrationResultSet } from 'kysely';
import { DirMigrationProvider } from './dirMigrationProvider.js';
import type { Database } from './schema.js';

function migrator(db: Kysely<Database>): Migrator {
  return new Migrator({ db, provider: new DirMigrationProvider() });
}

function check(result: MigrationResultSet): string[] {
  if (result.error) {
    const failed = result.results?.find((r) => r.status === 'Error')?.migrationName;
    const reason = result.error instanceof Error ? result.error.message : String(result.error);
    throw new Error(`migration ${failed ?? '(unknown)'} failed: ${reason}`, { cause: result.error });
  }
  return (result.results ?? []).map((r) => r.migrationName);
}

/** Applies every pending migration (Kysely holds an advisory lock, so concurrent callers are safe). Returns the names applied. */
export async function migrateToLatest(db: Kysely<Database>): Promise<string[]> {
  return check(await migrator(db).migrateToLatest());
}

/** Reverts the most recent migration. Returns the names reverted. */
export async function migrateDown(db: Kysely<Database>): Promise<string[]> {
  return check(await migrator(db).migrateDown());
}

/** Names of migrations in the code that the database has not applied (empty: the schema is current). */
export async function pendingMigrations(db: Kysely<Database>): Promise<string[]> {
  const all = await migrator(db).getMigrations();
  return all.filter((m) => !m.executedAt).map((m) => m.name);
}
