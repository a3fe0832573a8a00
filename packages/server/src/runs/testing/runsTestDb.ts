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

/**
 * A fresh, migrated database of its own for one test file: the worker processes a test spawns
 * see only that file's runs.
 */
export async function createTestDb(name: string): Promise<{ db: Db; url: string }> {
  const admin = new pg.Client({ connectionString: testDbUrl('postgres') });
  await admin.connect();
  try {
    await admin.query(`drop database if exists "${name}" with (force)`);
    await admin.query(`create database "${name}"`);
  } finally {
    await admin.end();
  }
  const url = testDbUrl(name);
  const db = createDb(url, { max: 6 });
  await migrateToLatest(db);
  return { db, url };
}
