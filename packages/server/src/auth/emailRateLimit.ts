import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';

/**
 * A per IP + email rate limit for the auth routes that take an email, answering 429 JSON.
 * Keyed on both, so one address cannot hammer one account and one user cannot lock out everyone
 * behind the same IP. Memory store: one per app instance, enough for one server process.
 */
export function emailRateLimit(o: {
  limit: number;
  windowMs: number;
  /** Count only failed (status >= 400) requests. */
  failuresOnly: boolean;
  message: string;
}): RequestHandler {
  return rateLimit({
    windowMs: o.windowMs,
    limit: o.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: o.failuresOnly,
    keyGenerator: (req) => {
      const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
      return `${ipKeyGenerator(req.ip ?? 'unknown')}|${email}`;
    },
    handler: (_req, res) => {
      res.status(429).json({ error: { message: o.message } });
    },
  });
}
