/** The shared, migrated test database (tests make unique data, so files can share it). */
export const TEST_DATABASE_URL =
  process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:55432/sigmatail_test';
