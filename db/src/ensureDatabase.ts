import pg from 'pg';

/**
 * Creates the database named in `url` when it does not exist yet. Connects to the database itself
 * first, so a role without access to the cluster's `postgres` database works when the database
 * exists; only a missing database (3D000) leads to `create database`. Safe when several processes
 * race: a duplicate is not an error.
 */
export async function ensureDatabase(url: string): Promise<void> {
  const name = decodeURIComponent(new URL(url).pathname.replace(/^\//, ''));
  if (!name) throw new Error('database URL names no database');
  const probe = new pg.Client({ connectionString: url });
  try {
    await probe.connect();
    return;
  } catch (err) {
    if ((err as { code?: string }).code !== '3D000') throw err;
  } finally {
    await probe.end().catch(() => undefined);
  }
  const admin = new URL(url);
  admin.pathname = '/postgres';
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    await client.query(`create database "${name.replace(/"/g, '""')}"`);
  } catch (err) {
    // 42P04 duplicate_database, 23505 unique_violation: another process created it first.
    const code = (err as { code?: string }).code;
    if (code !== '42P04' && code !== '23505') throw err;
  } finally {
    await client.end();
  }
}
