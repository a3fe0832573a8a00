// API read latency under load: 100 concurrent clients (autocannon, loopback, 10 s) reading a
// run's status while a 1e7-sample run computes on a worker on the same machine.
// Run: npx tsx --conditions=@sigmatail/source bench/apiLoad.ts [seconds] [connections]
import os from 'node:os';
import autocannon from 'autocannon';
import { startStack, startWorker } from './runEndToEnd.js';

const seconds = Number(process.argv[2] ?? 10);
const connections = Number(process.argv[3] ?? 100);
const stack = await startStack(process.env.BENCH_DB ?? 'sigmatail_bench_api');
const worker = startWorker(stack.url, 2);
try {
  await worker.waitFor(/started/);
  const { id } = await stack.api('POST', '/api/runs', {
    designId: stack.designId,
    samples: 10_000_000,
    seed: 'load',
    plan: 'random',
  });
  for (;;) {
    const { run } = await stack.api('GET', `/api/runs/${id}`);
    if (run.progress.done >= 2) break; // threads warm and computing
    await new Promise((r) => setTimeout(r, 100));
  }
  // autocannon reports p97.5 and p99 but not p95: record every response time and rank them.
  const times: number[] = [];
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon(
      {
        url: `${stack.base}/api/runs/${id}`,
        connections,
        duration: seconds,
        headers: { cookie: stack.cookie },
      },
      (err, res) => (err ? reject(err) : resolve(res)),
    );
    instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) =>
      times.push(ms),
    );
  });
  const before = (await stack.api('GET', `/api/runs/${id}`)).run;
  times.sort((a, b) => a - b);
  const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))]!;
  console.log(
    `GET /api/runs/:id, ${connections} connections, ${seconds} s, while a 1e7-sample run computes:`,
  );
  console.log(
    `machine: ${os.cpus().length} cores, load average ${os
      .loadavg()
      .map((x) => x.toFixed(1))
      .join(' ')}`,
  );
  console.log(`requests ${result.requests.total}, ${Math.round(result.requests.average)} req/s`);
  console.log(
    `latency ms: p50 ${q(0.5).toFixed(1)}  p95 ${q(0.95).toFixed(1)}  p99 ${q(0.99).toFixed(1)}  max ${result.latency.max}`,
  );
  console.log(`errors ${result.errors}, timeouts ${result.timeouts}, non-2xx ${result.non2xx}`);
  console.log(
    `run progress during the load: ${before.progress.done}/${before.progress.total} tasks, status ${before.status}`,
  );
  // A long load can outlast the run; only a run still in progress can be cancelled.
  const { run: after } = await stack.api('GET', `/api/runs/${id}`);
  if (!['done', 'failed', 'cancelled'].includes(after.status))
    await stack.api('POST', `/api/runs/${id}/cancel`);
} finally {
  await worker.stop();
  await stack.server.stop();
}
