import type { RequestHandler } from 'express';
import type { AppConfig } from '../config.js';
import { emailRateLimit } from './emailRateLimit.js';

/**
 * Failed sign-ins per IP + email: config.loginLimit per config.loginWindowMs. Only failures count,
 * so a team signing in all day from one office never hits it.
 */
export function loginRateLimit(config: AppConfig): RequestHandler {
  return emailRateLimit({
    limit: config.loginLimit,
    windowMs: config.loginWindowMs,
    failuresOnly: true,
    message: 'too many sign-in attempts; wait a few minutes and try again',
  });
}

/**
 * Reset mails per IP + email: as many per window as sign-in failures, every request counting, so
 * the form cannot be used to flood someone's inbox.
 */
export function forgotRateLimit(config: AppConfig): RequestHandler {
  return emailRateLimit({
    limit: Math.max(1, Math.floor(config.loginLimit / 2)),
    windowMs: config.loginWindowMs,
    failuresOnly: false,
    message: 'too many reset requests for this address; wait a few minutes and try again',
  });
}
