import { execFile } from 'node:child_process';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { pgTool } from './pgTools.js';

const run = promisify(execFile);

/**
 * Dumps the database at `url` in pg_dump's custom format (-Fc: compressed, restorable table by
 * table) into `dir`, as sigmatail-<database>-<UTC time>.dump. Returns the file's path.
 */
export async function backupDatabase(url: string, dir: string, now = new Date()): Promise<string> {
  mkdirSync(dir, { recursive: true });
  const name = decodeURIComponent(new URL(url).pathname.slice(1)) || 'postgres';
  const stamp = now
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z');
  const file = path.join(dir, `sigmatail-${name}-${stamp}.dump`);
  await run(pgTool('pg_dump'), ['--format=custom', '--no-owner', '--no-privileges', `--file=${file}`, url]);
  return file;
}
