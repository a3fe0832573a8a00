import type { Request } from 'express';
import type { AppConfig } from '../config.js';
import { HttpError } from '../http/httpError.js';
import { sourceKey, tokenRules } from './authThrottleRules.js';
import type { Throttle } from './throttle.js';

/**
 * Runs a handler step that looks up a mailed link's token, counting an unknown, used or expired
 * token (404, or 400 naming `token`) against the source; a source past tokenRules gets 429 before
 * any lookup. Link tokens are 256-bit, so this caps noise more than it stops a real guess.
 */
export async function countTokenFailures<T>(
  throttle: Throttle,
  config: AppConfig,
  req: Request,
  step: () => Promise<T>,
): Promise<T> {
  const rules = tokenRules(config, sourceKey(req));
  await throttle.check(rules, 'too many invalid links from your address; wait a few minutes and try again');
  try {
    return await step();
  } catch (err) {
    if (err instanceof HttpError && (err.status === 404 || err.field === 'token')) await throttle.hit(rules);
    throw err;
  }
}
