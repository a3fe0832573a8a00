// End to end: POST /api/runs → results stored, for 1e6 samples with the DC operating point per
// sample, through the real server and worker processes; then the speed-up of two worker threads
// over one. Run: npx tsx --conditions=@sigmatail/source bench/runEndToEnd.ts [samples] [repeats]
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { CAPACITOR_PARTS } from '@sigmatail/engine';

const REPO = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

export type Proc = {
  child: ChildProcess;
  waitFor(re: RegExp, ms?: number): Promise<string>;
  stop(): Promise<void>;
};

/** Starts a TypeScript entry of the repo as its own process (node + tsx loader). */
export function startProcess(entry: string, env: Record<string, string>, nodeArgs: string[] = []): Proc {
  const child = spawn(
    process.execPath,
    [...nodeArgs, '--conditions=@sigmatail/source', '--import', 'tsx', path.join(REPO, entry)],
    {
      cwd: REPO,
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  let out = '';
  const listeners: (() => void)[] = [];
  const onData = (b: Buffer) => {
    out += b.toString();
    listeners.forEach((l) => l());
  };
  child.stdout!.on('data', onData);
  child.stderr!.on('data', onData);
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  return {
    child,
    waitFor: (re, ms = 60_000) =>
      new Promise((resolve, reject) => {
        const t = setTimeout(() => reject(new Error(`${entry}: no ${re} within ${ms} ms:\n${out}`)), ms);
        const check = () => {
          const m = re.exec(out);
          if (m) {
            clearTimeout(t);
            resolve(m[0]);
          }
        };
        listeners.push(check);
        check();
      }),
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}

/** A fresh database with the demo workshop, the API server on it, and a signed-in engineer. */
export async function startStack(name: string) {
  const url = execFileSync('bash', [path.join(REPO, 'scripts/pg.sh'), 'reset-db', name], {
    encoding: 'utf8',
  }).trim();
  const server = startProcess('packages/server/src/main.ts', {
    DATABASE_URL: url,
    PORT: '0',
    SIGMATAIL_SEED_DEMO: '1',
    SIGMATAIL_MAIL_FAKE: '1',
    SMTP_PORT: '0',
    SIGMATAIL_SECRET: 'bench-secret-'.padEnd(40, 'x'),
    // No per-request log lines: this harness keeps all child output in memory and scans it.
    LOG_LEVEL: 'warn',
  });
  const base = (await server.waitFor(/http:\/\/127\.0\.0\.1:\d+/)).replace(/\/$/, '');
  const login = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'engineer@fenwick.example', password: 'tailpair-demo' }),
  });
  if (login.status !== 200) throw new Error(`sign-in failed: ${login.status}`);
  const cookie = login.headers.getSetCookie()[0]!.split(';')[0]!;
  const api = async (method: string, p: string, body?: unknown) => {
    const res = await fetch(base + p, {
      method,
      headers: { cookie, ...(body ? { 'content-type': 'application/json' } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    });
    const json = (await res.json()) as Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any
    if (res.status >= 400) throw new Error(`${method} ${p}: ${res.status} ${JSON.stringify(json)}`);
    return json;
  };
  const designId = await benchDesign(api);
  return { url, base, cookie, api, designId, server };
}

type Api = (method: string, p: string, body?: unknown) => Promise<Record<string, any>>; // eslint-disable-line @typescript-eslint/no-explicit-any

/**
 * The demo design the runs use: BENCH_DESIGN picks one by name (case-insensitive substring),
 * default the first listed. BENCH_MIDBAND=1 saves a copy without capacitors and frequency specs
 * (the midband-only kernel, ~10× cheaper per sample) and runs that instead.
 */
async function benchDesign(api: Api): Promise<string> {
  const { designs } = (await api('GET', '/api/designs')) as { designs: { id: string; name: string }[] };
  const want = process.env.BENCH_DESIGN?.toLowerCase();
  const picked = want ? designs.find((d) => d.name.toLowerCase().includes(want)) : designs[0];
  if (!picked)
    throw new Error(`no demo design named like "${want}": ${designs.map((d) => d.name).join(', ')}`);
  if (process.env.BENCH_MIDBAND !== '1') return picked.id;
  const { design } = await api('GET', `/api/designs/${picked.id}`);
  const doc = structuredClone(design.latestRevision.document) as {
    name: string;
    parts: Record<string, unknown>;
    specs?: { frequency?: number }[];
  };
  for (const id of CAPACITOR_PARTS) delete doc.parts[id];
  doc.specs = doc.specs?.filter((s) => s.frequency === undefined);
  doc.name = `${doc.name} (midband only)`;
  const created = await api('POST', '/api/designs', { document: doc });
  return created.design.id as string;
}

/** A worker process; `nice` 0 for throughput figures, the default 10 when the API shares the machine. */
export function startWorker(url: string, threads: number, nice = 10): Proc {
  return startProcess(
    'packages/server/src/worker/main.ts',
    {
      DATABASE_URL: url,
      SIGMATAIL_WORKER_THREADS: String(threads),
      SIGMATAIL_WORKER_NICE: String(nice),
      SIGMATAIL_POLL_MS: '1000',
      SMTP_PORT: '9',
    },
    // BENCH_WORKER_PROFILE=DIR writes a CPU profile of the worker's main thread there when it stops.
    process.env.BENCH_WORKER_PROFILE
      ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_WORKER_PROFILE}`]
      : [],
  );
}

type Stack = Awaited<ReturnType<typeof startStack>>;

/** Launches a run and polls until it ends; returns wall time from POST to 'done' seen by the client. */
export async function timedRun(stack: Stack, samples: number, seed: string) {
  const t0 = performance.now();
  const { id } = await stack.api('POST', '/api/runs', {
    designId: stack.designId,
    samples,
    seed,
    plan: 'random',
    // BENCH_ANALYSES=off times the Monte Carlo chunks alone (the once-per-run analyses are one task).
    ...(process.env.BENCH_ANALYSES === 'off'
      ? { analyses: { influence: false, varianceIndices: false, worstCase: false } }
      : {}),
  });
  for (;;) {
    const { run } = await stack.api('GET', `/api/runs/${id}`);
    if (run.status === 'done') {
      const wall = (performance.now() - t0) / 1000;
      const db = (Date.parse(run.finishedAt) - Date.parse(run.createdAt)) / 1000;
      return { id: id as string, wall, db };
    }
    if (run.status === 'failed' || run.status === 'cancelled')
      throw new Error(`run ${run.status}: ${run.error}`);
    // Polled every 100 ms, not faster: the polling (API server + PostgreSQL) shares the 2 cores.
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** CPU seconds (user + system, all threads) a process has used so far, from /proc; NaN elsewhere. */
function processCpu(pid: number | undefined): number {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(f[11]) + Number(f[12])) / 100; // utime, stime in clock ticks (100 Hz on Linux)
  } catch {
    return NaN;
  }
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

async function main() {
  const samples = Number(process.argv[2] ?? 1_000_000);
  const repeats = Number(process.argv[3] ?? 3);
  const stack = await startStack(process.env.BENCH_DB ?? 'sigmatail_bench_e2e');
  const rows: { threads: number; wall: number; best: number; db: number; cpu: number }[] = [];
  let worker: Proc | undefined;
  try {
    for (const threads of [1, 2]) {
      worker = startWorker(stack.url, threads, 0);
      await worker.waitFor(/started/);
      await timedRun(stack, 100_000, 'warm-up'); // threads load the engine, JIT warms up
      const walls: number[] = [];
      const dbs: number[] = [];
      const cpus: number[] = [];
      for (let i = 0; i < repeats; i++) {
        const cpu0 = processCpu(worker.child.pid);
        const r = await timedRun(stack, samples, `bench-${threads}-${i}`);
        const cpu = processCpu(worker.child.pid) - cpu0;
        walls.push(r.wall);
        dbs.push(r.db);
        cpus.push(cpu);
        console.log(
          `threads=${threads} run ${i + 1}: ${r.wall.toFixed(2)} s (database clock ${r.db.toFixed(2)} s), worker CPU ${cpu.toFixed(2)} s (${(cpu / r.wall).toFixed(2)} cores busy)`,
        );
      }
      rows.push({
        threads,
        wall: median(walls),
        best: Math.min(...walls),
        db: median(dbs),
        cpu: median(cpus),
      });
      await worker.stop();
    }
  } finally {
    await worker?.stop();
    await stack.server.stop();
  }
  console.log(
    `\nEnd to end, ${samples.toLocaleString('en-US')} samples, DC point per sample (median of ${repeats}), design "${process.env.BENCH_DESIGN ?? '(first)'}"${process.env.BENCH_MIDBAND === '1' ? ' midband only' : ''}:`,
  );
  console.log(
    `machine: ${os.cpus().length} cores, load average ${os
      .loadavg()
      .map((x) => x.toFixed(1))
      .join(' ')}`,
  );
  console.log(
    'threads | median POST → done (s) | best (s) | samples/s (median) | speed-up (median, best) | worker CPU (s) | cores busy',
  );
  for (const r of rows) {
    const rate = Math.round(samples / r.wall).toLocaleString('en-US');
    const up = `${(rows[0]!.wall / r.wall).toFixed(2)}×, ${(rows[0]!.best / r.best).toFixed(2)}×`;
    const busy = (r.cpu / r.wall).toFixed(2);
    console.log(
      `${r.threads} | ${r.wall.toFixed(2)} | ${r.best.toFixed(2)} | ${rate} | ${up} | ${r.cpu.toFixed(2)} | ${busy}`,
    );
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await main();
