import { existsSync } from 'node:fs';
import path from 'node:path';

/** Debian's PostgreSQL 15 client programs (the same major version as the server). */
export const PG_BIN = process.env.SIGMATAIL_PG_BIN ?? '/usr/lib/postgresql/15/bin';

/** Full path of a PostgreSQL program (pg_dump, pg_restore), or an error saying what is missing. */
export function pgTool(name: 'pg_dump' | 'pg_restore'): string {
  const file = path.join(PG_BIN, name);
  if (!existsSync(file)) {
    throw new Error(`${file} not found: install postgresql-15 (Debian) or set SIGMATAIL_PG_BIN`);
  }
  return file;
}
