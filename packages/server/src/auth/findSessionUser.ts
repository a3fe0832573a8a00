import type { Database } from '@sigmatail/db';
import { sql, type Kysely } from 'kysely';
import type { SessionUser } from './requireRole.js';

/**
 * A user with their role in one workspace (the oldest membership when workspaceId is omitted),
 * plus their session epoch. Undefined when the user has no such membership, or (with sessionId)
 * when that session is unknown, revoked, expired or someone else's: one query decides it all.
 */
export async function findSessionUser(
  db: Kysely<Database>,
  where: { userId?: string; email?: string; workspaceId?: string; sessionId?: string },
): Promise<(SessionUser & { sessionEpoch: number; passwordHash: string }) | undefined> {
  let q = db
    .selectFrom('users as u')
    .innerJoin('memberships as m', 'm.user_id', 'u.id')
    .innerJoin('workspaces as w', 'w.id', 'm.workspace_id')
    .select([
      'u.id',
      'u.email',
      'u.name',
      'u.session_epoch as sessionEpoch',
      'u.password_hash as passwordHash',
      'm.role',
      'w.id as workspaceId',
      'w.name as workspaceName',
    ])
    .orderBy('m.created_at')
    .limit(1);
  if (where.userId) q = q.where('u.id', '=', where.userId);
  if (where.email) q = q.where('u.email', '=', where.email);
  if (where.workspaceId) q = q.where('m.workspace_id', '=', where.workspaceId);
  if (where.sessionId) {
    const sessionId = where.sessionId;
    q = q.where(({ exists, selectFrom }) =>
      exists(
        selectFrom('sessions as s')
          .select('s.id')
          .where('s.id', '=', sessionId)
          .whereRef('s.user_id', '=', 'u.id')
          .where('s.revoked_at', 'is', null)
          .where('s.expires_at', '>', sql<Date>`now()`),
      ),
    );
  }
  return q.executeTakeFirst();
}
