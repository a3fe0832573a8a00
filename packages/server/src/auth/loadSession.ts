import type { RequestHandler } from 'express';
import type { AppDeps } from '../appDeps.js';
import { findSessionUser } from './findSessionUser.js';
import { sessionCacheFor } from './sessionCache.js';
import { SESSION_COOKIE, verifySessionToken } from './sessionToken.js';

/**
 * Sets req.user from the session cookie. A sign-out (revoked session row), a removed member, a
 * changed role or a bumped session_epoch (sign-out everywhere, password reset) takes effect at
 * once: the session, user and membership are read from the database in one query, through a
 * one-second cache of resolved tokens that the routes making those changes clear in every server
 * process (see SessionCache). An invalid cookie just means "not signed in".
 */
export function loadSession({ db, config }: AppDeps): RequestHandler {
  const cache = sessionCacheFor(db, config.sessionCacheTtlMs);
  return async (req, _res, next) => {
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof token !== 'string' || !token) return next();
    const user = await cache.get(token, async () => {
      const claims = await verifySessionToken(token, config.secret);
      if (!claims) return undefined;
      const row = await findSessionUser(db, {
        userId: claims.userId,
        workspaceId: claims.workspaceId,
        sessionId: claims.sessionId,
      });
      if (!row || row.sessionEpoch !== claims.epoch) {
        return { userId: claims.userId, user: null, expiresAt: claims.expiresAt };
      }
      const { sessionEpoch: _e, passwordHash: _p, ...sessionUser } = row;
      return {
        userId: claims.userId,
        user: { ...sessionUser, sessionId: claims.sessionId },
        expiresAt: claims.expiresAt,
      };
    });
    // A copy per request: the cached object is shared by every request on this session.
    if (user) req.user = { ...user };
    next();
  };
}
