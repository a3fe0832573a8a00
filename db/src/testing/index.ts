// Test helpers of the database package (the '@sigmatail/db/testing' entry): the shared test database.
export { setUpTestDatabase } from './setUpTestDatabase.js';
export { siblingDatabaseUrl, TEST_DATABASE_URL } from './testDatabaseUrl.js';
