import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { TooManyRequests } from '../auth/throttle.js';
import { isDatabaseUnavailable } from './databaseUnavailable.js';
import { HttpError } from './httpError.js';
import { locateJsonError } from './locateJsonError.js';

export interface ErrorBody {
  error: {
    message: string;
    field?: string;
    issues?: { path: string; message: string }[];
    /** Malformed JSON: where it broke (0-based character offset, 1-based line and column). */
    position?: number;
    line?: number;
    column?: number;
  };
}

/** The JSON body size limit of express.json, in bytes (also named in the 413 message). */
export const JSON_BODY_LIMIT_BYTES = 2 * 1024 * 1024;

/** Unknown /api paths answer JSON 404, not the SPA page. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `no such endpoint: ${req.method} ${req.originalUrl.split('?')[0]}`));
};

/** Every error becomes JSON. Client mistakes are 4xx naming the field; only real faults are 500. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let status = 500;
  let body: ErrorBody;
  if (err instanceof HttpError) {
    status = err.status;
    if (err instanceof TooManyRequests && !res.headersSent)
      res.set('Retry-After', String(err.retryAfterSeconds));
    body = {
      error: {
        message: err.message,
        ...(err.field ? { field: err.field } : {}),
        ...(err.issues ? { issues: err.issues } : {}),
      },
    };
  } else if (err instanceof ZodError) {
    status = 400;
    const issues = err.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
    const first = issues[0];
    // A problem with the body as a whole (not an object, wrong type) has an empty path: name the body.
    const field = first ? first.path || 'body' : undefined;
    body = {
      error: {
        message: first ? `${first.path || 'body'}: ${first.message}` : 'invalid input',
        field,
        issues,
      },
    };
  } else if (isClientError(err)) {
    // body-parser (bad JSON, too large) and the router (undecodable %-escapes) mark these 4xx.
    status = err.status;
    if (err.type === 'entity.parse.failed') {
      const at = typeof err.body === 'string' ? locateJsonError(err.body) : null;
      body = {
        error: {
          message: at
            ? `malformed JSON body: it breaks at line ${at.line}, column ${at.column} (position ${at.position})`
            : `malformed JSON body: ${err.message}`,
          field: 'body',
          ...(at ?? {}),
        },
      };
    } else if (err.type === 'entity.too.large') {
      body = {
        error: {
          message: `request body too large: the limit is ${JSON_BODY_LIMIT_BYTES / 1024 / 1024} MB`,
          field: 'body',
        },
      };
    } else if (err.type === 'encoding.unsupported' || err.type === 'charset.unsupported') {
      body = { error: { message: err.message, field: 'Content-Type' } };
    } else {
      body = { error: { message: err.message } };
    }
  } else if (isDatabaseUnavailable(err)) {
    status = 503;
    res.set('Retry-After', '5');
    body = { error: { message: 'the database is unavailable right now; try again in a few seconds' } };
    req.log?.warn({ err }, 'database unavailable');
  } else {
    (req.log ?? console).error({ err }, 'unhandled error');
    body = { error: { message: 'internal error' } };
  }
  if (res.headersSent) return;
  res.status(status).json(body);
};

function isClientError(
  err: unknown,
): err is { status: number; type?: string; message: string; body?: unknown } {
  const e = err as { status?: unknown; expose?: unknown };
  return typeof e?.status === 'number' && e.status >= 400 && e.status < 500 && e.expose !== false;
}
