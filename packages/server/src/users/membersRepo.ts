import type { Database, Role } from '@sigmatail/db';
import type { Kysely, Transaction } from 'kysely';
import { HttpError } from '../http/httpError.js';

/** All SQL about who belongs to a workspace, with which role. */

type Db = Kysely<Database> | Transaction<Database>;

export function listMembers(db: Db, workspaceId: string) {
  return db
    .selectFrom('memberships as m')
    .innerJoin('users as u', 'u.id', 'm.user_id')
    .select(['u.id', 'u.email', 'u.name', 'm.role', 'm.created_at as joinedAt'])
    .where('m.workspace_id', '=', workspaceId)
    .orderBy('u.name')
    .execute();
}

export function listOpenInvites(db: Db, workspaceId: string) {
  return db
    .selectFrom('invites')
    .select(['id', 'email', 'role', 'expires_at as expiresAt', 'created_at as createdAt'])
    .where('workspace_id', '=', workspaceId)
    .where('accepted_at', 'is', null)
    .where('expires_at', '>', new Date())
    .orderBy('created_at', 'desc')
    .execute();
}

/**
 * The member's current role, after locking the workspace row: role changes in one workspace run
 * one at a time, so two admins demoting each other at once cannot leave it without an admin.
 * 404 when the user is not a member.
 */
export async function lockMemberRole(
  tx: Transaction<Database>,
  workspaceId: string,
  userId: string,
): Promise<Role> {
  await tx.selectFrom('workspaces').select('id').where('id', '=', workspaceId).forUpdate().execute();
  const m = await tx
    .selectFrom('memberships')
    .select('role')
    .where('workspace_id', '=', workspaceId)
    .where('user_id', '=', userId)
    .executeTakeFirst();
  if (!m) throw new HttpError(404, 'user not found');
  return m.role;
}

/** 409 unless the workspace has an admin besides `userId` (nobody could manage it otherwise). */
export async function assertOtherAdmin(
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

export async function setMemberRole(
  tx: Transaction<Database>,
  workspaceId: string,
  userId: string,
  role: Role,
) {
  await tx
    .updateTable('memberships')
    .set({ role })
    .where('workspace_id', '=', workspaceId)
    .where('user_id', '=', userId)
    .execute();
}

/** Removes the membership only: the account, its designs and the audit trail stay. */
export async function removeMember(tx: Transaction<Database>, workspaceId: string, userId: string) {
  await tx
    .deleteFrom('memberships')
    .where('workspace_id', '=', workspaceId)
    .where('user_id', '=', userId)
    .execute();
}
