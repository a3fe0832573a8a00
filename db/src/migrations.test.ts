import { randomBytes } from 'node:crypto';
import { sql } from 'kysely';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { createDb } from './createDb.js';
import { DirMigrationProvider } from './dirMigrationProvider.js';
import { ensureDatabase } from './ensureDatabase.js';
import { migrateDown, migrateToLatest } from './migrateToLatest.js';
import { siblingDatabaseUrl, TEST_DATABASE_URL } from './testing/testDatabaseUrl.js';

async function dropDatabase(name: string): Promise<void> {
  const client = new pg.Client({ connectionString: siblingDatabaseUrl('postgres') });
  await client.connect();
  await client.query(`drop database if exists "${name}" with (force)`);
  await client.end();
}

describe('migrations', () => {
  it('are named YYYY_MM_DD_HHMM_name and each has up and down', async () => {
    const migrations = await new DirMigrationProvider().getMigrations();
    const names = Object.keys(migrations);
    expect(names.length).toBeGreaterThan(0);
    for (const name of names) {
      expect(name).toMatch(/^\d{4}_\d{2}_\d{2}_\d{4}_[a-z0-9_]+$/);
      expect(typeof migrations[name]!.up).toBe('function');
      expect(typeof migrations[name]!.down).toBe('function');
    }
  });

  it('go up, all the way down, and up again on an empty database', async () => {
    const name = `sigmatail_mig_${randomBytes(4).toString('hex')}`;
    await ensureDatabase(siblingDatabaseUrl(name));
    const db = createDb(siblingDatabaseUrl(name), { max: 1 });
    try {
      const applied = await migrateToLatest(db);
      expect(applied.length).toBeGreaterThan(0);
      expect(await migrateToLatest(db)).toEqual([]);
      for (let i = 0; i < applied.length; i++) await migrateDown(db);
      const tables = await sql<{ n: number }>`
        select count(*)::int as n from information_schema.tables
        where table_schema = 'public' and table_name not like 'kysely_%'`.execute(db);
      expect(tables.rows[0]!.n).toBe(0);
      expect(await migrateToLatest(db)).toEqual(applied);
    } finally {
      await db.destroy();
      await dropDatabase(name);
    }
  });

  it('leave the shared test database at the latest version', async () => {
    const db = createDb(TEST_DATABASE_URL, { max: 1 });
    try {
      expect(await migrateToLatest(db)).toEqual([]);
    } finally {
      await db.destroy();
    }
  });
});
