import { createDb, ensureDatabase, migrateToLatest } from '@sigmatail/db';
import { TEST_DATABASE_URL } from './testDatabaseUrl.js';

/** vitest global setup: create and migrate the test database once per test run. */
export default async function setup(): Promise<void> {
  await ensureDatabase(TEST_DATABASE_URL);
  const db = createDb(TEST_DATABASE_URL, { max: 1 });
  try {
    await migrateToLatest(db);
  } finally {
    await db.destroy();
  }
}
