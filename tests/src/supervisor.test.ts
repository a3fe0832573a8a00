import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import net from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createDb } from '@sigmatail/db';
import { siblingDatabaseUrl } from '@sigmatail/db/testing';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REPO } from './e2eHarness.js';

// `npm start`'s supervisor as a real process tree (server, mail fake, worker) on free ports and a
// database of its own: a worker killed with SIGKILL comes back, and a second supervisor refuses.

function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

const dbName = `sigmatail_sup_${randomBytes(4).toString('hex')}`;
let env: NodeJS.ProcessEnv;
let supervisor: ChildProcess;
let out = '';

function startSupervisor(): ChildProcess {
  return spawn(
    process.execPath,
    ['--conditions=@sigmatail/source', '--import', 'tsx', 'scripts/supervise.ts'],
    {
      cwd: REPO,
      env,
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
}

/** Resolves with the first match of `re` in the supervisor's output after `from` (a string offset). */
async function waitFor(re: RegExp, from = 0, timeoutMs = 90_000): Promise<RegExpExecArray> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const m = re.exec(out.slice(from));
    if (m) return m;
    if (Date.now() > until) throw new Error(`no ${re} in supervisor output:\n${out}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  env = {
    ...process.env,
    PORT: String(await freePort()),
    SMTP_PORT: String(await freePort()),
    DATABASE_URL: siblingDatabaseUrl(dbName),
    SIGMATAIL_RUN_DIR: mkdtempSync(path.join(tmpdir(), 'sigmatail-run-')),
    SIGMATAIL_SECRET: randomBytes(32).toString('hex'),
    SIGMATAIL_WORKER_THREADS: '1',
  };
  delete env.APP_URL;
  supervisor = startSupervisor();
  for (const s of [supervisor.stdout, supervisor.stderr]) s?.on('data', (d: Buffer) => (out += d.toString()));
  await waitFor(/Sigmatail is running at/);
}, 120_000);

afterAll(async () => {
  if (supervisor && supervisor.exitCode === null) {
    supervisor.kill('SIGTERM');
    await new Promise((r) => supervisor.once('exit', r));
  }
  const admin = createDb(siblingDatabaseUrl('postgres'), { max: 1 });
  await sql.raw(`drop database if exists "${dbName}" with (force)`).execute(admin);
  await admin.destroy();
}, 60_000);

describe('npm start supervisor', () => {
  it('restarts a worker killed with SIGKILL, says so, and the API stays up', async () => {
    const first = Number((await waitFor(/worker started \(pid (\d+)\)/))[1]);
    const mark = out.length;
    process.kill(first, 'SIGKILL');
    await waitFor(/worker exited \(SIGKILL\); restarting in 1 s/, mark);
    const second = Number((await waitFor(/worker started \(pid (\d+)\)/, mark))[1]);
    expect(second).not.toBe(first);
    expect(() => process.kill(second, 0)).not.toThrow();
    const health = await fetch(`http://127.0.0.1:${env.PORT}/api/health`);
    expect(health.status).toBe(200);
  });

  it('a second npm start while one runs says so and exits', async () => {
    const again = startSupervisor();
    let err = '';
    again.stderr?.on('data', (d: Buffer) => (err += d.toString()));
    const code = await new Promise<number | null>((r) => again.once('exit', r));
    expect(code).toBe(1);
    expect(err).toMatch(/already running at http:\/\/127\.0\.0\.1:\d+ \(supervisor pid \d+\)/);
  });

  it('stops every child on SIGTERM and releases the lock', async () => {
    supervisor.kill('SIGTERM');
    expect(await new Promise((r) => supervisor.once('exit', r))).toBe(0);
    const pids = [...out.matchAll(/started \(pid (\d+)\)/g)].map((m) => Number(m[1]));
    await new Promise((r) => setTimeout(r, 200));
    const stillAlive = pids.filter((pid) => {
      try {
        process.kill(pid, 0);
        return true;
      } catch {
        return false;
      }
    });
    expect(stillAlive).toEqual([]);
  });
});
