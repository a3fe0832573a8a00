// The server's tests share the database package's test database.
export { TEST_DATABASE_URL } from '@sigmatail/db/testing';
