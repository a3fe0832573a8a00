import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export type SpawnedWorker = {
  proc: ChildProcess;
  output: string[];
  /** Resolves with the first output line matching `re` (already printed or future). */
  waitFor: (re: RegExp, timeoutMs?: number) => Promise<string>;
  /** Sends `signal` and resolves when the process has exited. */
  kill: (signal: NodeJS.Signals) => Promise<void>;
};

/** Starts a worker process from TypeScript source (node + tsx loader), as `npm run worker` does. */
export function spawnWorker(script: URL, env: Record<string, string>): SpawnedWorker {
  const proc = spawn(
    process.execPath,
    ['--conditions=@sigmatail/source', '--import', 'tsx', fileURLToPath(script)],
    { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] },
  );
  const output: string[] = [];
  const waiters: { re: RegExp; resolve: (l: string) => void }[] = [];
  const onData = (buf: Buffer) => {
    for (const line of buf.toString().split('\n').filter(Boolean)) {
      output.push(line);
      for (const w of [...waiters]) {
        if (w.re.test(line)) {
          waiters.splice(waiters.indexOf(w), 1);
          w.resolve(line);
        }
      }
    }
  };
  proc.stdout!.on('data', onData);
  proc.stderr!.on('data', onData);
  const exited = new Promise<void>((resolve) => proc.once('exit', () => resolve()));
  return {
    proc,
    output,
    waitFor: (re, timeoutMs = 20_000) => {
      const seen = output.find((l) => re.test(l));
      if (seen) return Promise.resolve(seen);
      return new Promise((resolve, reject) => {
        const t = setTimeout(
          () => reject(new Error(`no line matching ${re} in:\n${output.join('\n')}`)),
          timeoutMs,
        );
        waiters.push({ re, resolve: (l) => (clearTimeout(t), resolve(l)) });
      });
    },
    kill: async (signal) => {
      if (proc.exitCode === null && proc.signalCode === null) proc.kill(signal);
      await exited;
    },
  };
}
