import type { Database, Role } from '@sigmatail/db';
import { Router } from 'express';
import type { Kysely, Transaction } from 'kysely';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireRole } from '../auth/requireRole.js';
import { roleField } from '../http/fields.js';
import { HttpError } from '../http/httpError.js';
import { uuidParam } from '../http/uuidParam.js';

const patchBody = z.object({ role: roleField });

/**
 * The member's current role, after locking the workspace row: role changes in one workspace run
 * one at a time, so two admins demoting each other at once cannot leave it without an admin.
 */
async function memberRole(db: Kysely<Database> | Transaction<Database>, workspaceId: string, userId: string) {
  await db.selectFrom('workspaces').select('id').where('id', '=', workspaceId).forUpdate().execute();
  const m = await db
    .selectFrom('memberships')
    .select('role')
    .where('workspace_id', '=', workspaceId)
    .where('user_id', '=', userId)
    .forUpdate()
    .executeTakeFirst();
  if (!m) throw new HttpError(404, 'user not found');
  return m.role;
}

/** A workspace must keep an admin, or nobody could manage it again. */
async function assertOtherAdmin(
  tx: Transaction<Database>,
  workspaceId: string,
  userId: string,
): Promise<void> {
  const other = await tx
    .selectFrom('memberships')
    .select('user_id')
    .where('workspace_id', '=', workspaceId)
    .where('role', '=', 'admin')
    .where('user_id', '!=', userId)
    .limit(1)
    .executeTakeFirst();
  if (!other) throw new HttpError(409, 'the workspace needs at least one other admin first', 'role');
}

/** GET /users (members and open invites), PATCH /users/:id {role}, DELETE /users/:id (admin only). */
export function createUsersRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/users', requireRole('admin'), async (req, res) => {
    const ws = req.user!.workspaceId;
    const users = await db
      .selectFrom('memberships as m')
      .innerJoin('users as u', 'u.id', 'm.user_id')
      .select(['u.id', 'u.email', 'u.name', 'm.role', 'm.created_at as joinedAt'])
      .where('m.workspace_id', '=', ws)
      .orderBy('u.name')
      .execute();
    const invites = await db
      .selectFrom('invites')
      .select(['id', 'email', 'role', 'expires_at as expiresAt', 'created_at as createdAt'])
      .where('workspace_id', '=', ws)
      .where('accepted_at', 'is', null)
      .where('expires_at', '>', new Date())
      .orderBy('created_at', 'desc')
      .execute();
    res.json({ users, invites });
  });

  router.patch('/users/:id', requireRole('admin'), async (req, res) => {
    const userId = uuidParam(req, 'id', 'user');
    const { role } = patchBody.parse(req.body ?? {});
    const admin = req.user!;
    await db.transaction().execute(async (tx) => {
      const before: Role = await memberRole(tx, admin.workspaceId, userId);
      if (before === 'admin' && role !== 'admin') await assertOtherAdmin(tx, admin.workspaceId, userId);
      await tx
        .updateTable('memberships')
        .set({ role })
        .where('workspace_id', '=', admin.workspaceId)
        .where('user_id', '=', userId)
        .execute();
      await recordAudit(tx, {
        workspaceId: admin.workspaceId,
        userId: admin.id,
        action: 'user.role',
        target: userId,
        detail: { from: before, to: role },
      });
    });
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
      const before = await memberRole(tx, admin.workspaceId, userId);
      if (before === 'admin') await assertOtherAdmin(tx, admin.workspaceId, userId);
      // Only the membership goes: the account, its designs and audit trail stay.
      await tx
        .deleteFrom('memberships')
        .where('workspace_id', '=', admin.workspaceId)
        .where('user_id', '=', userId)
        .execute();
      await recordAudit(tx, {
        workspaceId: admin.workspaceId,
        userId: admin.id,
        action: 'user.remove',
        target: userId,
        detail: { role: before },
      });
    });
    res.status(204).end();
  });

  return router;
}
