// Runs the app's processes for `npm start`: the API/web server (migrates and seeds first), the local mail
// fake and one worker. Prints the URL and the demo sign-ins. A child that crashes is restarted with
// back-off (1 s, 2 s, 4 s … 30 s), so a crashed worker never takes the API down; Ctrl-C stops them all.
// A second `npm start` while one runs says so and exits (pid lock in SIGMATAIL_RUN_DIR, default .data/).
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { formatLogLine } from './formatLogLine.js';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const port = Number(process.env.PORT ?? 3000);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${port}`;
const env = { ...process.env, PORT: String(port), SMTP_PORT: String(smtpPort), APP_URL: appUrl };
const runDir = process.env.SIGMATAIL_RUN_DIR ?? path.join(repo, '.data');
const lockFile = path.join(runDir, 'supervisor.json');

// Back-off between restarts of one child: common practice, no source.
const FIRST_DELAY_MS = 1_000;
const MAX_DELAY_MS = 30_000;
/** A child that stayed up this long counts as healthy again: its next crash restarts after FIRST_DELAY_MS. */
const STABLE_MS = 60_000;
/** The server gives up after this many crashes in a row that each came within STABLE_MS of its start. */
const SERVER_MAX_QUICK_CRASHES = 5;

const log = (line: string): void => void process.stdout.write(`[supervisor] ${line}\n`);

function portFree(p: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.createServer();
    s.once('error', () => resolve(false));
    s.listen(p, '127.0.0.1', () => s.close(() => resolve(true)));
  });
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Takes the run lock, or says who holds it and exits. A lock left by a dead supervisor is taken over. */
function takeLock(): void {
  mkdirSync(runDir, { recursive: true });
  try {
    const held = JSON.parse(readFileSync(lockFile, 'utf8')) as { pid: number; url: string };
    if (held.pid !== process.pid && alive(held.pid)) {
      console.error(
        `Sigmatail is already running at ${held.url} (supervisor pid ${held.pid}). ` +
          `Use that one, or stop it first (Ctrl-C in its terminal, or kill ${held.pid}).`,
      );
      process.exit(1);
    }
  } catch {
    // no lock, or an unreadable one: ours now
  }
  writeFileSync(lockFile, JSON.stringify({ pid: process.pid, url: appUrl }) + '\n');
}

function releaseLock(): void {
  try {
    const held = JSON.parse(readFileSync(lockFile, 'utf8')) as { pid: number };
    if (held.pid === process.pid) rmSync(lockFile);
  } catch {
    // already gone
  }
}

interface Supervised {
  name: string;
  entry: string;
  extraEnv: Record<string, string>;
  child: ChildProcess | null;
  startedAt: number;
  quickCrashes: number;
  restartTimer: NodeJS.Timeout | null;
}

const supervised: Supervised[] = [];
/** SIGMATAIL_LOG_JSON=1: print the children's pino records as they are (for a log collector). */
const rawJson = process.env.SIGMATAIL_LOG_JSON === '1';
let stopping = false;

function pipeLines(name: string, stream: NodeJS.ReadableStream | null): void {
  let buf = '';
  stream?.on('data', (d: Buffer) => {
    buf += d.toString();
    const lines = buf.split('\n');
    buf = lines.pop() ?? '';
    for (const l of lines) process.stdout.write(`[${name}] ${rawJson ? l : formatLogLine(l)}\n`);
  });
}

function start(s: Supervised): void {
  s.restartTimer = null;
  if (stopping) return;
  // node itself with tsx as a loader (not the tsx CLI, which would run the entry in a grandchild):
  // the pid we watch and signal is the process doing the work.
  const child = spawn(process.execPath, ['--conditions=@sigmatail/source', '--import', 'tsx', s.entry], {
    cwd: repo,
    env: { ...env, ...s.extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  s.child = child;
  s.startedAt = Date.now();
  log(`${s.name} started (pid ${child.pid})`);
  pipeLines(s.name, child.stdout);
  pipeLines(s.name, child.stderr);
  child.on('exit', (code, signal) => {
    if (s.child === child) s.child = null;
    if (stopping) return;
    const upMs = Date.now() - s.startedAt;
    s.quickCrashes = upMs >= STABLE_MS ? 1 : s.quickCrashes + 1;
    const how = signal ?? `code ${code}`;
    if (s.name === 'server' && s.quickCrashes > SERVER_MAX_QUICK_CRASHES) {
      log(`server exited (${how}) ${s.quickCrashes} times in a row soon after starting; giving up.`);
      void stopAll(1);
      return;
    }
    const delay = Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 2 ** (s.quickCrashes - 1));
    log(`${s.name} exited (${how}); restarting in ${delay / 1000} s (restart ${s.quickCrashes} in a row)`);
    s.restartTimer = setTimeout(() => start(s), delay);
  });
}

function supervise(name: string, entry: string, extraEnv: Record<string, string> = {}): void {
  const s: Supervised = {
    name,
    entry,
    extraEnv,
    child: null,
    startedAt: 0,
    quickCrashes: 0,
    restartTimer: null,
  };
  supervised.push(s);
  start(s);
}

async function stopAll(code: number): Promise<void> {
  if (stopping) return;
  stopping = true;
  const running = supervised.flatMap((s) => {
    if (s.restartTimer) clearTimeout(s.restartTimer);
    return s.child && s.child.exitCode === null && s.child.signalCode === null ? [s.child] : [];
  });
  for (const c of running) c.kill('SIGTERM');
  await Promise.all(running.map((c) => new Promise((r) => c.once('exit', r))));
  releaseLock();
  process.exit(code);
}

async function waitForHealth(timeoutMs: number): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      const res = await fetch(`http://127.0.0.1:${port}/api/health`);
      if (res.ok) return true;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

takeLock();
for (const [p, what, envName] of [
  [port, 'the web/API server', 'PORT'],
  [smtpPort, 'the local mail fake', 'SMTP_PORT'],
] as const) {
  if (!(await portFree(p))) {
    console.error(
      `port ${p} (${what}) is already in use by another program: stop it or set ${envName}=<free port>.`,
    );
    releaseLock();
    process.exit(1);
  }
}

process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

supervise('server', 'packages/server/src/main.ts', { SIGMATAIL_SEED_DEMO: '1' });
if (!(await waitForHealth(60_000))) {
  console.error('the server did not become healthy within 60 s; see the [server] lines above.');
  await stopAll(1);
}
supervise('mail', 'packages/server/src/mailFakeMain.ts');
supervise('worker', 'packages/server/src/worker/main.ts');

console.log(`
  Sigmatail is running at ${appUrl}

  Demo sign-ins (password: tailpair-demo)
    admin@fenwick.example        admin
    engineer@fenwick.example     engineer
    production@fenwick.example   production
    viewer@fenwick.example       viewer

  Mail sent by the app lands in the dev inbox (admin → Inbox). Ctrl-C stops the app;
  'npm run db:stop' stops PostgreSQL. A crashed worker, mail fake or server is restarted.

  CAUTION: the circuits designed here carry lethal voltages. Discharge capacitors, respect ratings.
  Results are a design aid, not a substitute for local codes and licensed practice.
`);
