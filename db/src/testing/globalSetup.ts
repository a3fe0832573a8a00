import { createDb } from '../createDb.js';
import { ensureDatabase } from '../ensureDatabase.js';
import { migrateToLatest } from '../migrateToLatest.js';
import { TEST_DATABASE_URL } from './testDatabaseUrl.js';

/** vitest global setup: create and migrate the shared test database once per run. */
export default async function setup(): Promise<void> {
  await ensureDatabase(TEST_DATABASE_URL);
  const db = createDb(TEST_DATABASE_URL, { max: 1 });
  try {
    await migrateToLatest(db);
  } finally {
    await db.destroy();
  }
}
