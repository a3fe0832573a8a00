import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { pino, type Logger } from 'pino';
import { pinoHttp, type HttpLogger } from 'pino-http';

/**
 * The process logger: one JSON object per line on stdout (pino), level from LOG_LEVEL (default
 * info; silent under vitest unless LOG_LEVEL is set).
 */
export function createLogger(name = 'sigmatail-server'): Logger {
  const level = process.env.LOG_LEVEL ?? (process.env.VITEST ? 'silent' : 'info');
  return pino({ name, level });
}

// A caller's own request id is kept when it looks like one (so logs join across a proxy).
const REQUEST_ID = /^[A-Za-z0-9._:-]{1,100}$/;

/**
 * Request logging with an id per request: X-Request-Id from the caller when well-formed, else a new
 * UUID; sent back as the X-Request-Id response header and on every log line of the request
 * (req.log). Only method, URL, address and status are logged (cookies and the auth header are
 * redacted besides).
 */
export function requestLogger(logger: Logger): HttpLogger {
  return pinoHttp({
    logger,
    genReqId: (req: IncomingMessage, res: ServerResponse) => {
      const given = req.headers['x-request-id'];
      const id = typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    redact: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'],
    // One short line per request: who asked what and the answer; headers stay out of the log.
    serializers: {
      req: (req: { id: unknown; method: string; url: string; remoteAddress?: string }) => ({
        id: req.id,
        method: req.method,
        url: req.url,
        remoteAddress: req.remoteAddress,
      }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    customLogLevel: (_req, res, err) =>
      err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info',
  });
}
