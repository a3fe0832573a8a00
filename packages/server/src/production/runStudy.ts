import { Piscina } from 'piscina';
import { HttpError } from '../http/httpError.js';
import type { StudyInput } from './studyJob.js';

const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
const taskUrl = new URL(`./studyTask${ext}`, import.meta.url);
let pool: Piscina | null = null;

/**
 * Runs a production study on a pool thread, so a long plan search (seconds in the worst case)
 * never holds up the API's event loop. One thread, started on first use and let go when idle.
 * An engine RangeError becomes a 400 naming its field (the message's first word, e.g.
 * "samples" or "prices.resistors").
 */
export async function runStudy<T>(input: StudyInput): Promise<T> {
  pool ??= new Piscina({
    filename: taskUrl.href,
    minThreads: 0,
    maxThreads: 1,
    idleTimeout: 5_000,
    execArgv:
      ext === '.ts' && !process.execArgv.some((a) => a.includes('tsx'))
        ? [...process.execArgv, '--conditions=@sigmatail/source', '--import', 'tsx']
        : process.execArgv,
  });
  const out = (await pool.run(input)) as { result: T } | { rangeError: string };
  if ('rangeError' in out) throw new HttpError(400, out.rangeError, out.rangeError.split(/[: ]/)[0]);
  return out.result;
}
