import type { RequestHandler } from 'express';
import { HttpError } from './httpError.js';

/**
 * Body types the API reads: JSON everywhere, plus file uploads (multipart/form-data, parsed by
 * multer on the routes that take a file) and raw CSV. A route that does not parse a type it gets
 * sees no body and answers 400 naming the missing fields.
 */
export const ACCEPTED_BODY_TYPES = ['application/json', 'multipart/form-data', 'text/csv'];

/**
 * A body of any other type (HTML form posts, text, XML) gets 415 JSON naming Content-Type instead
 * of being silently ignored and reported as missing fields.
 */
export const requireJsonBody: RequestHandler = (req, _res, next) => {
  const hasBody =
    req.headers['transfer-encoding'] !== undefined || Number(req.headers['content-length'] ?? 0) > 0;
  if (!hasBody || req.is(ACCEPTED_BODY_TYPES)) return next();
  const type = req.headers['content-type'] ?? 'none';
  next(
    new HttpError(
      415,
      `send the request body as application/json (Content-Type was ${type})`,
      'Content-Type',
    ),
  );
};
