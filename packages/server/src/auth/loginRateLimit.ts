import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppConfig } from '../config.js';

/**
 * Limits failed sign-in attempts per IP + email (config.loginLimit per config.loginWindowMs), so one
 * address cannot guess passwords and one user cannot lock out everyone behind the same IP.
 * Memory store: one per app instance, which is enough for one server process.
 */
export function loginRateLimit(config: AppConfig): RequestHandler {
  return rateLimit({
    windowMs: config.loginWindowMs,
    limit: config.loginLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Only failed attempts count: a team signing in all day from one office never hits it.
    skipSuccessfulRequests: true,
    keyGenerator: (req) => {
      const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
      return `${ipKeyGenerator(req.ip ?? 'unknown')}|${email}`;
    },
    handler: (_req, res) => {
      res
        .status(429)
        .json({ error: { message: 'too many sign-in attempts; wait a few minutes and try again' } });
    },
  });
}
