// Runs the app's processes for `npm start`: the API/web server (migrates and seeds first), the local mail
// fake and one worker. Prints the URL and the demo sign-ins, stops everything on Ctrl-C or when one dies.
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const tsx = path.join(repo, 'node_modules/.bin/tsx');
const port = Number(process.env.PORT ?? 3000);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const appUrl = process.env.APP_URL ?? `http://127.0.0.1:${port}`;
const env = { ...process.env, PORT: String(port), SMTP_PORT: String(smtpPort), APP_URL: appUrl };

function portFree(p: number): Promise<boolean> {
  return new Promise((resolve) => {
    const s = net.createServer();
    s.once('error', () => resolve(false));
    s.listen(p, '127.0.0.1', () => s.close(() => resolve(true)));
  });
}

const children: ChildProcess[] = [];
let stopping = false;

function run(name: string, entry: string, extraEnv: Record<string, string> = {}): ChildProcess {
  const child = spawn(tsx, ['--conditions=@sigmatail/source', entry], {
    cwd: repo,
    env: { ...env, ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const prefix = (line: string) => `[${name}] ${line}\n`;
  for (const stream of [child.stdout, child.stderr]) {
    let buf = '';
    stream?.on('data', (d: Buffer) => {
      buf += d.toString();
      const lines = buf.split('\n');
      buf = lines.pop() ?? '';
      for (const l of lines) process.stdout.write(prefix(l));
    });
  }
  child.on('exit', (code, signal) => {
    if (stopping) return;
    console.error(`[${name}] exited (${signal ?? code}); stopping the others.`);
    void stopAll(1);
  });
  children.push(child);
  return child;
}

async function stopAll(code: number): Promise<void> {
  stopping = true;
  for (const c of children) if (c.exitCode === null) c.kill('SIGTERM');
  await Promise.all(
    children.map((c) => (c.exitCode === null ? new Promise((r) => c.once('exit', r)) : undefined)),
  );
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

for (const [p, what, envName] of [
  [port, 'the web/API server', 'PORT'],
  [smtpPort, 'the local mail fake', 'SMTP_PORT'],
] as const) {
  if (!(await portFree(p))) {
    console.error(
      `port ${p} (${what}) is already in use: stop the other process or set ${envName}=<free port>.`,
    );
    process.exit(1);
  }
}

process.on('SIGINT', () => void stopAll(0));
process.on('SIGTERM', () => void stopAll(0));

run('server', 'packages/server/src/main.ts', { SIGMATAIL_SEED_DEMO: '1' });
if (!(await waitForHealth(60_000))) {
  console.error('the server did not become healthy within 60 s; see the [server] lines above.');
  await stopAll(1);
}
run('mail', 'packages/server/src/mailFakeMain.ts');
run('worker', 'packages/server/src/worker/main.ts');

console.log(`
  Sigmatail is running at ${appUrl}

  Demo sign-ins (password: tailpair-demo)
    admin@fenwick.example        admin
    engineer@fenwick.example     engineer
    production@fenwick.example   production
    viewer@fenwick.example       viewer

  Mail sent by the app lands in the dev inbox (admin → Inbox). Ctrl-C stops the app;
  'npm run db:stop' stops PostgreSQL.

  CAUTION: the circuits designed here carry lethal voltages. Discharge capacitors, respect ratings.
  Results are a design aid, not a substitute for local codes and licensed practice.
`);
