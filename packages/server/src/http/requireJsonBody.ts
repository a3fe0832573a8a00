import type { RequestHandler } from 'express';
import { HttpError } from './httpError.js';

/**
 * Every request body the API takes is JSON: a body of another type (form posts, text, XML) gets
 * 415 JSON naming Content-Type instead of being silently ignored and reported as missing fields.
 */
export const requireJsonBody: RequestHandler = (req, _res, next) => {
  const hasBody =
    req.headers['transfer-encoding'] !== undefined || Number(req.headers['content-length'] ?? 0) > 0;
  if (!hasBody || req.is('application/json')) return next();
  const type = req.headers['content-type'] ?? 'none';
  next(
    new HttpError(
      415,
      `send the request body as application/json (Content-Type was ${type})`,
      'Content-Type',
    ),
  );
};
