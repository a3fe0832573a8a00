// npm run db:backup            → dumps DATABASE_URL into backups/ and prints the file name
// npm run db:restore <file>    → restores a dump into DATABASE_URL (exit 2 and one line when misused)
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { backupDatabase } from './backupDatabase.js';
import { restoreDatabase } from './restoreDatabase.js';

const REPO = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const url = process.env.DATABASE_URL || 'postgres://postgres@127.0.0.1:55432/sigmatail';
const redacted = url.replace(/:\/\/([^:@/]+):[^@/]*@/, '://$1:***@');

function usage(message: string): never {
  console.error(message);
  process.exit(2);
}

const [command, file] = process.argv.slice(2);
try {
  if (command === 'backup') {
    const out = await backupDatabase(url, process.env.SIGMATAIL_BACKUP_DIR ?? path.join(REPO, 'backups'));
    console.log(out);
  } else if (command === 'restore') {
    if (!file) usage('usage: npm run db:restore <file.dump> (a file made by npm run db:backup)');
    const full = path.resolve(process.env.INIT_CWD ?? process.cwd(), file);
    if (!existsSync(full)) usage(`no such backup file: ${full}`);
    await restoreDatabase(url, full);
    console.log(`restored ${full} into ${redacted}`);
  } else {
    usage('usage: backupCli.ts backup | restore <file.dump>');
  }
} catch (err) {
  const e = err as Error & { stderr?: string };
  console.error(`${command} failed: ${(e.stderr || e.message).trim().split('\n')[0]}`);
  process.exit(1);
}
