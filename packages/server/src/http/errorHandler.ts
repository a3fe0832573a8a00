import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { HttpError } from './httpError.js';

export interface ErrorBody {
  error: { message: string; field?: string; issues?: { path: string; message: string }[] };
}

/** Unknown /api paths answer JSON 404, not the SPA page. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, `no such endpoint: ${req.method} ${req.originalUrl.split('?')[0]}`));
};

/** Every error becomes JSON. Client mistakes are 4xx naming the field; only real faults are 500. */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  let status = 500;
  let body: ErrorBody;
  if (err instanceof HttpError) {
    status = err.status;
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
    const field = first?.path || undefined;
    body = {
      error: {
        message: first ? `${first.path || 'body'}: ${first.message}` : 'invalid input',
        field,
        issues,
      },
    };
  } else if (isBodyParserError(err)) {
    status = err.status;
    body = {
      error: { message: err.type === 'entity.too.large' ? 'request body too large' : 'malformed JSON body' },
    };
  } else {
    console.error(err);
    body = { error: { message: 'internal error' } };
  }
  if (res.headersSent) return;
  res.status(status).json(body);
};

function isBodyParserError(err: unknown): err is { status: number; type: string } {
  const e = err as { status?: unknown; type?: unknown };
  return typeof e?.status === 'number' && e.status >= 400 && e.status < 500 && typeof e.type === 'string';
}
