import { execFile } from 'node:child_process';
import { chmodSync, copyFileSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';
import { REPO } from '../src/e2eHarness.js';

const run = promisify(execFile);
const isRoot = process.getuid?.() === 0;

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });
}

/**
 * A fresh checkout under a mode-700 directory (as /root is) must still get its own database: the
 * server runs as 'postgres', which cannot enter such a path, so pg.sh keeps the data elsewhere.
 */
describe.skipIf(!isRoot)('scripts/pg.sh in a checkout the database user cannot enter', () => {
  const home = mkdtempSync(path.join(tmpdir(), 'sigmatail-home-'));
  const checkout = path.join(home, 'checkout');
  let env: NodeJS.ProcessEnv = {};
  let dataDir = '';

  afterAll(async () => {
    if (env.SIGMATAIL_PGPORT) {
      await run('bash', [path.join(checkout, 'scripts/pg.sh'), 'stop'], { env }).catch(() => {});
    }
    if (dataDir && !dataDir.startsWith(REPO)) rmSync(path.dirname(dataDir), { recursive: true, force: true });
    rmSync(home, { recursive: true, force: true });
  });

  it('starts, says where the data lives, restarts idempotently and stops', async () => {
    chmodSync(home, 0o700);
    mkdirSync(path.join(checkout, 'scripts'), { recursive: true });
    copyFileSync(path.join(REPO, 'scripts/pg.sh'), path.join(checkout, 'scripts/pg.sh'));
    const { SIGMATAIL_PGDATA: _ignored, ...rest } = process.env;
    env = { ...rest, SIGMATAIL_PGPORT: String(await freePort()) };
    const pg = (...args: string[]) => run('bash', [path.join(checkout, 'scripts/pg.sh'), ...args], { env });

    const first = await pg('start');
    expect(first.stdout.trim()).toBe(`postgres://postgres@127.0.0.1:${env.SIGMATAIL_PGPORT}/sigmatail`);
    dataDir = (await pg('datadir')).stdout.trim();
    expect(dataDir.startsWith(home)).toBe(false);
    expect(first.stderr).toContain(`keeping this checkout's data in ${dataDir}`);

    const second = await pg('start');
    expect(second.stdout.trim()).toBe(first.stdout.trim());
    expect(second.stderr).toBe('');
    expect((await pg('reset-db', 'anywhere_check')).stdout.trim()).toMatch(/\/anywhere_check$/);
    expect((await pg('status')).stdout).toContain('running');
    await pg('stop');
    await expect(pg('status')).rejects.toMatchObject({ code: 3 });
  });
});
