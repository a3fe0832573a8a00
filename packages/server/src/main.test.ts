import { spawn } from 'node:child_process';
import { createServer, type Server } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TEST_DATABASE_URL } from './testing/testDatabaseUrl.js';

const HERE = path.dirname(fileURLToPath(import.meta.url));

/** Runs main.ts as a real process; resolves on exit or once `until` shows up in stdout. */
function runMain(env: Record<string, string>, until?: RegExp) {
  // node itself (not the tsx wrapper), so the PID we signal is the server's own.
  const child = spawn(
    process.execPath,
    ['--import', 'tsx', '--conditions=@sigmatail/source', path.join(HERE, 'main.ts')],
    {
      env: { ...process.env, DATABASE_URL: TEST_DATABASE_URL, SIGMATAIL_SECRET: 'x'.repeat(40), ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  let stdout = '';
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const done = new Promise<{ code: number | null; stdout: string; stderr: string }>((resolve) => {
    child.stdout.on('data', (d: Buffer) => {
      stdout += d.toString();
      if (until?.test(stdout)) resolve({ code: null, stdout, stderr });
    });
    child.on('exit', (code) => resolve({ code, stdout, stderr }));
  });
  return { child, done };
}

let blocker: Server;
let busyPort: number;
beforeAll(async () => {
  blocker = createServer();
  await new Promise<void>((r) => blocker.listen(0, '127.0.0.1', () => r()));
  busyPort = (blocker.address() as { port: number }).port;
});
afterAll(() => new Promise<void>((r) => blocker.close(() => r())));

// Each case starts a real process (a few seconds under tsx), so they run side by side.
describe.concurrent('main (process entry)', () => {
  it('prints one clear line and exits 1 when the port is taken', async () => {
    const { done } = runMain({ PORT: String(busyPort), SMTP_PORT: '0' });
    const { code, stderr } = await done;
    expect(code).toBe(1);
    expect(stderr.trim()).toBe(`port ${busyPort} is already in use — stop the other process or set PORT`);
  });

  it('migrates, listens and answers /api/health', async () => {
    const { child, done } = runMain(
      { PORT: '0', SMTP_PORT: '0', SIGMATAIL_MAIL_FAKE: '1' },
      /on http:\/\/127\.0\.0\.1:(\d+)/,
    );
    try {
      const { stdout } = await done;
      const port = /127\.0\.0\.1:(\d+)/.exec(stdout)![1];
      const res = await fetch(`http://127.0.0.1:${port}/api/health`);
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ ok: true, db: 'up' });
    } finally {
      child.kill('SIGTERM');
    }
  });

  it('is ready on /readyz, logs JSON lines, and on SIGTERM finishes and exits 0', async () => {
    const { child, done } = runMain(
      { PORT: '0', SMTP_PORT: '0', SIGMATAIL_MAIL_FAKE: '1', LOG_LEVEL: 'info' },
      /on http:\/\/127\.0\.0\.1:(\d+)/,
    );
    const { stdout } = await done;
    const port = /127\.0\.0\.1:(\d+)/.exec(stdout)![1];
    const ready = await fetch(`http://127.0.0.1:${port}/readyz`);
    expect(ready.status).toBe(200);
    let out = '';
    child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
    const exited = new Promise<number | null>((r) => child.once('exit', r));
    child.kill('SIGTERM');
    expect(await exited).toBe(0);
    const messages = out
      .split('\n')
      .filter((l) => l.startsWith('{'))
      .map((l) => (JSON.parse(l) as { msg: string }).msg);
    expect(messages).toEqual(
      expect.arrayContaining(['shutting down: finishing requests in flight', 'stopped']),
    );
  });
});
