import { setUpTestDatabase } from './setUpTestDatabase.js';
import { TEST_DATABASE_URL } from './testDatabaseUrl.js';

/** vitest global setup: create and migrate the shared test database once per run. */
export default async function setup(): Promise<void> {
  await setUpTestDatabase(TEST_DATABASE_URL);
}
