import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { newMailToken } from '../auth/mailToken.js';
import { inviteRules } from '../auth/authThrottleRules.js';
import { requireRole } from '../auth/requireRole.js';
import { Throttle } from '../auth/throttle.js';
import { emailField, roleField } from '../http/fields.js';
import { HttpError } from '../http/httpError.js';
import { uuidParam } from '../http/uuidParam.js';
import { escapeHtml } from '../mail/escapeHtml.js';

// Seven days: common practice, no source.
const INVITE_TTL_MS = 7 * 24 * 3600 * 1000;
export const inviteBody = z.object({ email: emailField, role: roleField });

/** POST /invites (admin): records an invite and mails the link APP_URL/invite/<token>; DELETE /invites/:id revokes it. */
export function createInvitesRouter({ db, mailer, config }: AppDeps): Router {
  const router = Router();
  const throttle = new Throttle(db, config.rateLimitScope);

  router.post('/invites', requireRole('admin'), async (req, res) => {
    const { email, role } = inviteBody.parse(req.body ?? {});
    const admin = req.user!;
    const rules = inviteRules(config, admin.workspaceId);
    await throttle.check(rules, 'too many invites sent from this workspace; wait a while and try again');
    const member = await db
      .selectFrom('memberships as m')
      .innerJoin('users as u', 'u.id', 'm.user_id')
      .select('u.id')
      .where('m.workspace_id', '=', admin.workspaceId)
      .where('u.email', '=', email)
      .executeTakeFirst();
    if (member) throw new HttpError(409, `${email} is already a member of this workspace`, 'email');

    const { token, hash } = newMailToken();
    const invite = await db
      .insertInto('invites')
      .values({
        workspace_id: admin.workspaceId,
        email,
        role,
        token_hash: hash,
        invited_by: admin.id,
        expires_at: new Date(Date.now() + INVITE_TTL_MS),
      })
      .returning(['id', 'email', 'role', 'expires_at'])
      .executeTakeFirstOrThrow();
    await throttle.hit(rules);
    const link = `${config.appUrl}/invite/${token}`;
    try {
      await mailer.send({
        to: email,
        subject: `${admin.name} invited you to ${admin.workspaceName} on Sigmatail`,
        text: `${admin.name} invited you to join ${admin.workspaceName} on Sigmatail as ${role}.\n\nAccept within 7 days:\n${link}\n`,
        html: `<p>${escapeHtml(admin.name)} invited you to join <b>${escapeHtml(admin.workspaceName)}</b> on Sigmatail as ${role}.</p><p><a href="${link}">Accept the invite</a> (valid for 7 days).</p>`,
      });
    } catch (err) {
      // No invite without its mail: nobody could use it.
      await db.deleteFrom('invites').where('id', '=', invite.id).execute();
      throw new HttpError(502, `the invite mail could not be sent: ${(err as Error).message}`);
    }
    await recordAudit(db, {
      workspaceId: admin.workspaceId,
      userId: admin.id,
      action: 'invite.create',
      target: email,
      detail: { role, inviteId: invite.id },
    });
    res.status(201).json({
      invite: { id: invite.id, email: invite.email, role: invite.role, expiresAt: invite.expires_at },
    });
  });

  // Revoking deletes the open invite, so its mailed link stops working at once.
  router.delete('/invites/:id', requireRole('admin'), async (req, res) => {
    const id = uuidParam(req, 'id', 'invite');
    const admin = req.user!;
    const gone = await db
      .deleteFrom('invites')
      .where('id', '=', id)
      .where('workspace_id', '=', admin.workspaceId)
      .where('accepted_at', 'is', null)
      .returning(['email', 'role'])
      .executeTakeFirst();
    if (!gone) throw new HttpError(404, 'invite not found');
    await recordAudit(db, {
      workspaceId: admin.workspaceId,
      userId: admin.id,
      action: 'invite.revoke',
      target: gone.email,
      detail: { role: gone.role, inviteId: id },
    });
    res.status(204).end();
  });

  return router;
}
