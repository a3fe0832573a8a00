import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireRole } from '../auth/requireRole.js';
import { sessionCacheFor } from '../auth/sessionCache.js';
import { roleField } from '../http/fields.js';
import { uuidParam } from '../http/uuidParam.js';
import {
  assertOtherAdmin,
  listMembers,
  listOpenInvites,
  lockMemberRole,
  removeMember,
  setMemberRole,
} from './membersRepo.js';

export const patchBody = z.object({ role: roleField });

/** GET /users (members and open invites), PATCH /users/:id {role}, DELETE /users/:id (admin only). */
export function createUsersRouter({ db }: AppDeps): Router {
  const router = Router();
  const sessions = sessionCacheFor(db);

  router.get('/users', requireRole('admin'), async (req, res) => {
    const ws = req.user!.workspaceId;
    res.json({ users: await listMembers(db, ws), invites: await listOpenInvites(db, ws) });
  });

  router.patch('/users/:id', requireRole('admin'), async (req, res) => {
    const userId = uuidParam(req, 'id', 'user');
    const { role } = patchBody.parse(req.body ?? {});
    const admin = req.user!;
    await db.transaction().execute(async (tx) => {
      const before = await lockMemberRole(tx, admin.workspaceId, userId);
      if (before === 'admin' && role !== 'admin') await assertOtherAdmin(tx, admin.workspaceId, userId);
      await setMemberRole(tx, admin.workspaceId, userId, role);
      await recordAudit(tx, {
        workspaceId: admin.workspaceId,
        userId: admin.id,
        action: 'user.role',
        target: userId,
        detail: { from: before, to: role },
      });
    });
    await sessions.forgetUser(userId); // the new role applies to the member's very next request
    const user = await db
      .selectFrom('users')
      .select(['id', 'email', 'name'])
      .where('id', '=', userId)
      .executeTakeFirstOrThrow();
    res.json({ user: { ...user, role } });
  });

  router.delete('/users/:id', requireRole('admin'), async (req, res) => {
    const userId = uuidParam(req, 'id', 'user');
    const admin = req.user!;
    await db.transaction().execute(async (tx) => {
      const before = await lockMemberRole(tx, admin.workspaceId, userId);
      if (before === 'admin') await assertOtherAdmin(tx, admin.workspaceId, userId);
      await removeMember(tx, admin.workspaceId, userId);
      await recordAudit(tx, {
        workspaceId: admin.workspaceId,
        userId: admin.id,
        action: 'user.remove',
        target: userId,
        detail: { role: before },
      });
    });
    await sessions.forgetUser(userId); // the removed member's very next request is refused
    res.status(204).end();
  });

  return router;
}
