import { setUpTestDatabase } from '@sigmatail/db/testing';
import { TEST_DATABASE_URL } from './testDatabaseUrl.js';

/** vitest global setup: create and migrate the test database once per test run. */
export default async function setup(): Promise<void> {
  await setUpTestDatabase(TEST_DATABASE_URL);
}
