import { createDb } from '../createDb.js';
import { ensureDatabase } from '../ensureDatabase.js';
import { migrateToLatest } from '../migrateToLatest.js';

/**
 * Creates the database at `url` if it is missing and migrates it to the latest schema, on one
 * connection that is closed again: what each package's vitest global setup does once per run.
 */
export async function setUpTestDatabase(url: string): Promise<void> {
  await ensureDatabase(url);
  const db = createDb(url, { max: 1 });
  try {
    await migrateToLatest(db);
  } finally {
    await db.destroy();
  }
}
