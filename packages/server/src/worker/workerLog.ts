import type { Logger } from 'pino';

/** Fields of a worker event: which run and chunk it concerns, the error, counts. */
export type WorkerLogFields = {
  runId?: string;
  chunkIndex?: number;
  attempt?: number;
  err?: string;
} & Record<string, unknown>;

/**
 * One worker event: a short message and its fields, so log lines can be filtered by run id and
 * chunk index. The worker process writes them through pino; tests collect them.
 */
export type WorkerLog = (
  level: 'debug' | 'info' | 'warn' | 'error',
  msg: string,
  fields?: WorkerLogFields,
) => void;

/** A WorkerLog writing one pino line per event. */
export function pinoWorkerLog(logger: Logger): WorkerLog {
  return (level, msg, fields) => logger[level](fields ?? {}, msg);
}

/** The message of a thrown value, for the `err` field. */
export const errorText = (err: unknown): string => (err instanceof Error ? err.message : String(err));
