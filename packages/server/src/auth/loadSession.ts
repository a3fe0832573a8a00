import type { RequestHandler } from 'express';
import type { AppDeps } from '../appDeps.js';
import { findSessionUser } from './findSessionUser.js';
import { SESSION_COOKIE, verifySessionToken } from './sessionToken.js';

/**
 * Sets req.user from the session cookie. The user and membership are read on every request, so a
 * removed member or a changed role takes effect at once, and a bumped session_epoch (sign-out
 * everywhere, password reset) voids older tokens. An invalid cookie just means "not signed in".
 */
export function loadSession({ db, config }: AppDeps): RequestHandler {
  return async (req, _res, next) => {
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof token !== 'string' || !token) return next();
    const claims = await verifySessionToken(token, config.secret);
    if (!claims) return next();
    const row = await findSessionUser(db, { userId: claims.userId, workspaceId: claims.workspaceId });
    if (row && row.sessionEpoch === claims.epoch) {
      const { sessionEpoch: _e, passwordHash: _p, ...user } = row;
      req.user = user;
    }
    next();
  };
}
