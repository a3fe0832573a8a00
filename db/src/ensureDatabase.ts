import pg from 'pg';

/**
 * Creates the database named in `url` when it does not exist yet (connecting to the cluster's
 * `postgres` database). Safe when several processes race: a duplicate is not an error.
 */
export async function ensureDatabase(url: string): Promise<void> {
  const target = new URL(url);
  const name = decodeURIComponent(target.pathname.replace(/^\//, ''));
  if (!name) throw new Error('database URL names no database');
  const admin = new URL(url);
  admin.pathname = '/postgres';
  const client = new pg.Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    const found = await client.query('select 1 from pg_database where datname = $1', [name]);
    if (found.rowCount) return;
    try {
      await client.query(`create database "${name.replace(/"/g, '""')}"`);
    } catch (err) {
      // 42P04 duplicate_database, 23505 unique_violation: another process created it first.
      const code = (err as { code?: string }).code;
      if (code !== '42P04' && code !== '23505') throw err;
    }
  } finally {
    await client.end();
  }
}
