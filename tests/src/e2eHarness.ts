import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { createDb, migrateToLatest, seedDemo, type Database } from '@sigmatail/db';
import { createApp, createSmtpMailer, DEFAULT_CONFIG, startMailFake } from '@sigmatail/server';
import type { Kysely } from 'kysely';
import { chromium, type Browser } from 'playwright-core';

export const REPO = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const WEB_DIST = path.join(REPO, 'packages/web/dist');
export const OUTPUT = path.join(REPO, 'tests/output');
const run = promisify(execFile);

export interface E2eHarness {
  baseUrl: string;
  db: Kysely<Database>;
  browser: Browser;
  stop(): Promise<void>;
}

/**
 * Everything a browser journey needs, started fresh: a new database (migrated, demo seeded), the
 * SMTP fake, the API server serving the built web app on a free port, one run worker process and
 * Debian chromium. `stop()` tears it all down in reverse order.
 */
export async function startE2e(
  dbName = process.env.SIGMATAIL_E2E_DB ?? 'sigmatail_e2e',
): Promise<E2eHarness> {
  if (!existsSync(path.join(WEB_DIST, 'index.html'))) {
    throw new Error(
      'packages/web/dist is missing: run `npm run build -w @sigmatail/web` before the browser tests',
    );
  }
  mkdirSync(OUTPUT, { recursive: true });
  const { stdout } = await run('bash', [path.join(REPO, 'scripts/pg.sh'), 'reset-db', dbName]);
  const databaseUrl = stdout.trim().split('\n').pop()!;
  const db = createDb(databaseUrl, { max: 6 });
  await migrateToLatest(db);
  await seedDemo(db);
  const fake = await startMailFake({ db, port: 0 });

  // Listen first so the mailed links can carry the real address.
  const server: Server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const config = {
    ...DEFAULT_CONFIG,
    secret: randomBytes(32).toString('hex'),
    appUrl: baseUrl,
    webDist: WEB_DIST,
  };
  const mailer = createSmtpMailer({ port: fake.port, from: config.mailFrom });
  server.on('request', createApp({ db, mailer, config }));

  const worker = startWorker(databaseUrl, fake.port);
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });

  return {
    baseUrl,
    db,
    browser,
    async stop() {
      await browser.close().catch(() => undefined);
      await stopProcess(worker);
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      mailer.close();
      await fake.close();
      await db.destroy();
    },
  };
}

/** One worker process from source (node + tsx loader), owned by this harness so it can be stopped by PID. */
function startWorker(databaseUrl: string, smtpPort: number): ChildProcess {
  const child = spawn(
    process.execPath,
    [
      '--import',
      'tsx',
      '--conditions=@sigmatail/source',
      path.join(REPO, 'packages/server/src/worker/main.ts'),
    ],
    {
      cwd: REPO,
      env: {
        ...process.env,
        DATABASE_URL: databaseUrl,
        SMTP_PORT: String(smtpPort),
        SIGMATAIL_WORKER_THREADS: '1',
        SIGMATAIL_POLL_MS: '200',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  const tail: string[] = [];
  const keep = (b: Buffer) => {
    tail.push(b.toString());
    if (tail.length > 40) tail.shift();
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);
  child.on('exit', (code, signal) => {
    if (code !== 0 && signal === null) console.error(`run worker exited with ${code}:\n${tail.join('')}`);
  });
  return child;
}

async function stopProcess(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  child.kill('SIGTERM');
  const timer = setTimeout(() => child.kill('SIGKILL'), 5000);
  timer.unref();
  await exited;
  clearTimeout(timer);
}
