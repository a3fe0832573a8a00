/**
 * One line of a child's output as `npm start` shows it: a pino JSON record becomes a short
 * readable line (time, level, the request or message, the few fields that say which run or
 * chunk); anything else passes through unchanged. The processes themselves keep logging JSON,
 * for log collectors; SIGMATAIL_LOG_JSON=1 makes the supervisor print the records as they are.
 */
const LEVELS: Record<number, string> = {
  10: 'trace',
  20: 'debug',
  30: 'info',
  40: 'WARN',
  50: 'ERROR',
  60: 'FATAL',
};

/** Fields shown after the message when present (the rest stay in the JSON record). */
const KEPT = [
  'runId',
  'chunkIndex',
  'attempt',
  'tasks',
  'mails',
  'threads',
  'leaseMs',
  'nice',
  'url',
  'to',
  'subject',
  'port',
  'err',
];

type PinoRecord = {
  level?: number;
  time?: number;
  msg?: string;
  req?: { method?: string; url?: string; id?: string };
  res?: { statusCode?: number };
  responseTime?: number;
  err?: { message?: string; type?: string } | string;
  [k: string]: unknown;
};

function hhmmss(t: number | undefined): string {
  const d = typeof t === 'number' ? new Date(t) : new Date();
  return d.toISOString().slice(11, 19);
}

function show(v: unknown): string {
  if (v && typeof v === 'object' && 'message' in v)
    return JSON.stringify(String((v as { message: unknown }).message));
  if (typeof v === 'string') return /\s/.test(v) ? JSON.stringify(v) : v;
  return JSON.stringify(v);
}

/**
 * @example formatLogLine('{"level":30,"time":0,"req":{"method":"GET","url":"/api/health"},"res":{"statusCode":200},"responseTime":4,"msg":"request completed"}')
 * // '00:00:00 info  GET /api/health 200 4 ms'
 */
export function formatLogLine(line: string): string {
  if (!line.startsWith('{')) return line;
  let r: PinoRecord;
  try {
    r = JSON.parse(line) as PinoRecord;
  } catch {
    return line;
  }
  if (typeof r.level !== 'number' || typeof r.msg !== 'string') return line;
  const level = (LEVELS[r.level] ?? String(r.level)).padEnd(5);
  let text: string;
  if (r.req?.method && r.res?.statusCode !== undefined) {
    const ms = typeof r.responseTime === 'number' ? ` ${Math.round(r.responseTime)} ms` : '';
    text = `${r.req.method} ${r.req.url ?? ''} ${r.res.statusCode}${ms}`;
  } else {
    text = r.msg;
  }
  const extra = KEPT.filter((k) => r[k] !== undefined).map((k) => `${k}=${show(r[k])}`);
  return [hhmmss(r.time), level, text, ...extra].join(' ');
}
