import { Kysely, PostgresDialect, sql } from 'kysely';
import pg from 'pg';
import * as runsMigration from '../../../../../db/src/migrations/2026_12_02_0001_runs.js';
import type { Db, RunsDatabase } from '../runsDb.js';

const base = process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:55432/sigmatail_test';

/** URL of a database named `name` on the test cluster. */
export function testDbUrl(name: string): string {
  const u = new URL(base);
  u.pathname = `/${name}`;
  return u.toString();
}

/** Creates (or empties) a database of its own for one test file and migrates it. */
export async function createTestDb(name: string): Promise<{ db: Db; url: string }> {
  const admin = new pg.Client({ connectionString: testDbUrl('postgres') });
  await admin.connect();
  await admin.query(`drop database if exists "${name}" with (force)`);
  await admin.query(`create database "${name}"`);
  await admin.end();
  const url = testDbUrl(name);
  const db = new Kysely<RunsDatabase>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 6 }) }),
  });
  await runsMigration.up(db as unknown as Kysely<unknown>);
  await sql`select 1`.execute(db);
  return { db, url };
}
