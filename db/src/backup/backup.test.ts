import { execFile } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtempSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { sql, type Kysely } from 'kysely';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../createDb.js';
import { ensureDatabase } from '../ensureDatabase.js';
import { migrateToLatest } from '../migrateToLatest.js';
import type { Database } from '../schema.js';
import { seedDemo } from '../seedDemo.js';
import { siblingDatabaseUrl } from '../testing/testDatabaseUrl.js';
import { backupDatabase } from './backupDatabase.js';
import { restoreDatabase } from './restoreDatabase.js';

const run = promisify(execFile);
const REPO = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const tag = randomBytes(4).toString('hex');
const source = `sigmatail_bk_src_${tag}`;
const target = `sigmatail_bk_dst_${tag}`;

afterAll(async () => {
  const admin = createDb(siblingDatabaseUrl('postgres'), { max: 1 });
  for (const name of [source, target])
    await sql.raw(`drop database if exists "${name}" with (force)`).execute(admin);
  await admin.destroy();
});

/** Every row of the tables a user cares about, as comparable text. */
async function contents(db: Kysely<Database>) {
  const designs = await db.selectFrom('designs').select(['id', 'name', 'latest_rev']).orderBy('id').execute();
  const revisions = await db
    .selectFrom('design_revisions')
    .select(['design_id', 'rev', sql<string>`document::text`.as('document')])
    .orderBy('design_id')
    .orderBy('rev')
    .execute();
  const runs = await db
    .selectFrom('runs')
    .select(['id', 'status', 'samples', 'seed'])
    .orderBy('id')
    .execute();
  const results = await db
    .selectFrom('run_results')
    .select(['run_id', 'joint_yield', sql<string>`results::text`.as('results')])
    .orderBy('run_id')
    .execute();
  const users = await db.selectFrom('users').select(['id', 'email', 'password_hash']).orderBy('id').execute();
  return { designs, revisions, runs, results, users };
}

describe('db:backup and db:restore', () => {
  it('a seeded database restored into a fresh one has every design, revision, run and result', async () => {
    await ensureDatabase(siblingDatabaseUrl(source));
    const db = createDb(siblingDatabaseUrl(source), { max: 2 });
    try {
      await migrateToLatest(db);
      const { workspaceId } = await seedDemo(db);
      const design = await db
        .selectFrom('designs')
        .selectAll()
        .where('workspace_id', '=', workspaceId)
        .executeTakeFirstOrThrow();
      const user = await db.selectFrom('users').select('id').executeTakeFirstOrThrow();
      const runRow = await db
        .insertInto('runs')
        .values({
          workspace_id: workspaceId,
          design_id: design.id,
          revision: 1,
          created_by: user.id,
          status: 'done',
          samples: 1000,
          seed: 'backup-test',
          plan: 'random',
          chunk_size: 1000,
          analyses: JSON.stringify({}),
          design: JSON.stringify({ name: design.name }),
          engine_version: 'test',
          chunk_total: 1,
          chunks_done: 1,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      await db
        .insertInto('run_results')
        .values({
          run_id: runRow.id,
          results: JSON.stringify({ jointYield: 0.9731 }),
          valid_count: 1000,
          joint_yield: 0.9731,
        })
        .execute();
      const before = await contents(db);
      expect(before.designs.length).toBeGreaterThan(0);
      expect(before.runs.length).toBe(1);

      const file = await backupDatabase(
        siblingDatabaseUrl(source),
        mkdtempSync(path.join(tmpdir(), 'sigmatail-bk-')),
      );
      expect(path.basename(file)).toMatch(new RegExp(`^sigmatail-${source}-\\d{8}T\\d{6}Z\\.dump$`));
      expect(statSync(file).size).toBeGreaterThan(1000);

      await restoreDatabase(siblingDatabaseUrl(target), file);
      const restored = createDb(siblingDatabaseUrl(target), { max: 2 });
      try {
        expect(await contents(restored)).toEqual(before);
        // The restored schema is current: nothing left to migrate, and new rows still get ids.
        expect(await migrateToLatest(restored)).toEqual([]);
        await restoreDatabase(siblingDatabaseUrl(target), file); // again over itself: same contents
        expect(await contents(restored)).toEqual(before);
      } finally {
        await restored.destroy();
      }
    } finally {
      await db.destroy();
    }
  }, 60_000);

  it('npm run db:restore without a file, or with a missing one, exits 2 with one line', async () => {
    const cli = (args: string[]) =>
      run(
        process.execPath,
        ['--conditions=@sigmatail/source', '--import', 'tsx', 'db/src/backup/backupCli.ts', ...args],
        {
          cwd: REPO,
          env: { ...process.env, DATABASE_URL: siblingDatabaseUrl(target) },
        },
      ).then(
        () => ({ code: 0, stderr: '' }),
        (e: { code: number; stderr: string }) => ({ code: e.code, stderr: e.stderr }),
      );
    const none = await cli(['restore']);
    expect(none.code).toBe(2);
    expect(none.stderr.trim()).toBe(
      'usage: npm run db:restore <file.dump> (a file made by npm run db:backup)',
    );
    const missing = await cli(['restore', 'backups/nope.dump']);
    expect(missing.code).toBe(2);
    expect(missing.stderr.trim()).toMatch(/^no such backup file: .*backups\/nope\.dump$/);
  }, 30_000);
});
