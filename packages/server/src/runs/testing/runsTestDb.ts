import { createDb, migrateToLatest } from '@sigmatail/db';
import pg from 'pg';
import type { Db } from '../runsDb.js';

const base = process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:55432/sigmatail_test';

/** URL of a database named `name` on the test cluster. */
export function testDbUrl(name: string): string {
  const u = new URL(base);
  u.pathname = `/${name}`;
  return u.toString();
}

async function admin(sqlText: string): Promise<void> {
  const client = new pg.Client({ connectionString: testDbUrl('postgres') });
  await client.connect();
  try {
    await client.query(sqlText);
  } finally {
    await client.end();
  }
}

/**
 * A fresh, migrated database of its own for one test file (the worker processes a test spawns
 * see only that file's runs). The name carries the process id, so two test runs on one cluster
 * never drop each other's database. `drop` closes the handle and removes the database.
 */
export async function createTestDb(
  prefix: string,
): Promise<{ db: Db; url: string; drop: () => Promise<void> }> {
  const name = `${prefix}_${process.pid}`;
  await admin(`drop database if exists "${name}" with (force)`);
  await admin(`create database "${name}"`);
  const url = testDbUrl(name);
  const db = createDb(url, { max: 6 });
  await migrateToLatest(db);
  return {
    db,
    url,
    drop: async () => {
      await db.destroy();
      await admin(`drop database if exists "${name}" with (force)`);
    },
  };
}
