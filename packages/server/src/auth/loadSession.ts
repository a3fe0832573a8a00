import type { RequestHandler } from 'express';
import type { AppDeps } from '../appDeps.js';
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
    const row = await db
      .selectFrom('users as u')
      .innerJoin('memberships as m', 'm.user_id', 'u.id')
      .innerJoin('workspaces as w', 'w.id', 'm.workspace_id')
      .select([
        'u.id',
        'u.email',
        'u.name',
        'u.session_epoch',
        'm.role',
        'w.id as workspaceId',
        'w.name as workspaceName',
      ])
      .where('u.id', '=', claims.userId)
      .where('m.workspace_id', '=', claims.workspaceId)
      .executeTakeFirst();
    if (row && row.session_epoch === claims.epoch) {
      req.user = {
        id: row.id,
        email: row.email,
        name: row.name,
        role: row.role,
        workspaceId: row.workspaceId,
        workspaceName: row.workspaceName,
      };
    }
    next();
  };
}
