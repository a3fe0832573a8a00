import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { HttpError } from '../http/httpError.js';
import { findSessionUser } from './findSessionUser.js';
import { presentMe } from './presentMe.js';
import { requireAuth } from './requireRole.js';
import { sessionCacheFor } from './sessionCache.js';
import { revokeSessions, setSessionCookie } from './sessionCookie.js';

export const switchBody = z.object({ workspaceId: z.uuid({ message: 'must be a workspace id' }) });

/**
 * GET /auth/workspaces (the signed-in user's memberships), POST /auth/workspace {workspaceId}
 * (re-issue the session for another of them). Sign-in lands in the oldest membership.
 */
export function createWorkspaceSwitchRouter({ db, config }: AppDeps): Router {
  const router = Router();

  router.get('/auth/workspaces', requireAuth, async (req, res) => {
    const workspaces = await db
      .selectFrom('memberships as m')
      .innerJoin('workspaces as w', 'w.id', 'm.workspace_id')
      .select(['w.id', 'w.name', 'm.role'])
      .where('m.user_id', '=', req.user!.id)
      .orderBy('m.created_at')
      .execute();
    res.json({ workspaces, current: req.user!.workspaceId });
  });

  router.post('/auth/workspace', requireAuth, async (req, res) => {
    const { workspaceId } = switchBody.parse(req.body ?? {});
    const me = await findSessionUser(db, { userId: req.user!.id, workspaceId });
    if (!me) throw new HttpError(404, 'you are not a member of that workspace', 'workspaceId');
    await setSessionCookie(
      res,
      { userId: me.id, workspaceId: me.workspaceId, epoch: me.sessionEpoch },
      config,
      db,
    );
    // The cookie of the workspace left behind is replaced, so its session ends.
    if (req.user!.sessionId) await revokeSessions(db, { sessionId: req.user!.sessionId });
    await sessionCacheFor(db).forgetUser(me.id);
    await recordAudit(db, { workspaceId: me.workspaceId, userId: me.id, action: 'auth.switch_workspace' });
    const { sessionEpoch: _e, passwordHash: _p, ...user } = me;
    res.json(presentMe(user));
  });

  return router;
}
