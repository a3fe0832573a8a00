import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { ensureDatabase } from '../ensureDatabase.js';
import { pgTool } from './pgTools.js';

const run = promisify(execFile);

/**
 * Restores a pg_dump custom-format file into the database at `url` (created when missing),
 * replacing the objects the dump holds, in one transaction: it all lands or nothing does.
 */
export async function restoreDatabase(url: string, file: string): Promise<void> {
  await ensureDatabase(url);
  await run(pgTool('pg_restore'), [
    '--clean',
    '--if-exists',
    '--no-owner',
    '--no-privileges',
    '--single-transaction',
    '--exit-on-error',
    `--dbname=${url}`,
    file,
  ]);
}
