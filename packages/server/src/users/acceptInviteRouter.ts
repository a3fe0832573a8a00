import bcrypt from 'bcryptjs';
import type { Database } from '@sigmatail/db';
import { Router } from 'express';
import type { Kysely } from 'kysely';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { findSessionUser } from '../auth/findSessionUser.js';
import { sessionCacheFor } from '../auth/sessionCache.js';
import { hashToken } from '../auth/mailToken.js';
import { presentMe } from '../auth/presentMe.js';
import { assertPasswordPolicy, hashPassword } from '../auth/passwordPolicy.js';
import { setSessionCookie } from '../auth/sessionCookie.js';
import { Throttle } from '../auth/throttle.js';
import { countTokenFailures } from '../auth/countTokenFailures.js';
import { nameField, passwordField, tokenField } from '../http/fields.js';
import { HttpError } from '../http/httpError.js';

export const acceptBody = z.object({ token: tokenField, name: nameField, password: passwordField });

function openInvite(db: Kysely<Database>, token: string) {
  return db
    .selectFrom('invites as i')
    .innerJoin('workspaces as w', 'w.id', 'i.workspace_id')
    .innerJoin('users as u', 'u.id', 'i.invited_by')
    .select([
      'i.id',
      'i.email',
      'i.role',
      'i.expires_at',
      'i.workspace_id',
      'w.name as workspaceName',
      'u.name as invitedBy',
    ])
    .where('i.token_hash', '=', hashToken(token))
    .where('i.accepted_at', 'is', null)
    .where('i.expires_at', '>', new Date());
}

/** GET /invites/:token (public: who invited whom, as what), POST /auth/accept-invite (creates the account, signs in). */
export function createAcceptInviteRouter({ db, config }: AppDeps): Router {
  const router = Router();
  const throttle = new Throttle(db, config.rateLimitScope);

  router.get('/invites/:token', async (req, res) => {
    const invite = await countTokenFailures(throttle, config, req, async () => {
      const token = tokenField.safeParse(req.params.token);
      const found = token.success ? await openInvite(db, token.data).executeTakeFirst() : undefined;
      if (!found) throw new HttpError(404, 'this invite link is invalid, used or expired');
      return found;
    });
    res.json({
      invite: {
        email: invite.email,
        role: invite.role,
        workspace: { name: invite.workspaceName },
        invitedBy: { name: invite.invitedBy },
        expiresAt: invite.expires_at,
      },
    });
  });

  router.post('/auth/accept-invite', async (req, res) => {
    const { token, name, password } = acceptBody.parse(req.body ?? {});
    const userId = await countTokenFailures(throttle, config, req, () =>
      db.transaction().execute(async (tx) => {
        const invite = await openInvite(tx, token).forUpdate('i').executeTakeFirst();
        if (!invite) throw new HttpError(400, 'this invite link is invalid, used or expired', 'token');
        let user = await tx
          .selectFrom('users')
          .select(['id', 'password_hash'])
          .where('email', '=', invite.email)
          .executeTakeFirst();
        if (user) {
          // An existing account joins with its own password; the invite must not let anyone replace it.
          if (!(await bcrypt.compare(password, user.password_hash))) {
            throw new HttpError(
              400,
              'this email already has an account: enter its current password',
              'password',
            );
          }
        } else {
          assertPasswordPolicy(password, invite.email);
          user = await tx
            .insertInto('users')
            .values({ email: invite.email, name, password_hash: await hashPassword(password) })
            .returning(['id', 'password_hash'])
            .executeTakeFirstOrThrow();
        }
        await tx
          .insertInto('memberships')
          .values({ user_id: user.id, workspace_id: invite.workspace_id, role: invite.role })
          .onConflict((oc) => oc.columns(['user_id', 'workspace_id']).doUpdateSet({ role: invite.role }))
          .execute();
        await tx
          .updateTable('invites')
          .set({ accepted_at: new Date() })
          .where('id', '=', invite.id)
          .execute();
        await recordAudit(tx, {
          workspaceId: invite.workspace_id,
          userId: user.id,
          action: 'invite.accept',
          target: invite.email,
          detail: { role: invite.role },
        });
        return { id: user.id, workspaceId: invite.workspace_id };
      }),
    );
    // A rejoining member's older session for this workspace is valid again (same epoch).
    await sessionCacheFor(db).forgetUser(userId.id);
    const me = await findSessionUser(db, { userId: userId.id, workspaceId: userId.workspaceId });
    if (!me) throw new HttpError(409, 'the membership was removed meanwhile');
    await setSessionCookie(
      res,
      { userId: me.id, workspaceId: me.workspaceId, epoch: me.sessionEpoch },
      config,
      db,
    );
    const { sessionEpoch: _e, passwordHash: _p, ...user } = me;
    res.json(presentMe(user));
  });

  return router;
}
