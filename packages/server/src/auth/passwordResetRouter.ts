import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { emailField, newPasswordField, tokenField } from '../http/fields.js';
import { HttpError } from '../http/httpError.js';
import { findSessionUser } from './findSessionUser.js';
import { assertPasswordPolicy, hashPassword } from './passwordPolicy.js';
import { forgotRules, sourceKey } from './authThrottleRules.js';
import { sessionCacheFor } from './sessionCache.js';
import { Throttle } from './throttle.js';
import { countTokenFailures } from './countTokenFailures.js';
import { revokeSessions } from './sessionCookie.js';
import { hashToken, newMailToken } from './mailToken.js';

// One hour: common practice, no source.
const RESET_TTL_MS = 60 * 60 * 1000;
export const forgotBody = z.object({ email: emailField });
export const resetBody = z.object({ token: tokenField, password: newPasswordField });
const FORGOT_ANSWER = { ok: true, message: 'if that address has an account, a reset link is on its way' };

/** POST /auth/forgot (mails a one-hour reset link), POST /auth/reset (sets the new password). */
export function createPasswordResetRouter({ db, mailer, config }: AppDeps): Router {
  const router = Router();
  const throttle = new Throttle(db, config.rateLimitScope);

  router.post('/auth/forgot', async (req, res) => {
    const { email } = forgotBody.parse(req.body ?? {});
    const rules = forgotRules(config, email, sourceKey(req));
    await throttle.check(
      rules,
      'too many reset requests from your address; wait a few minutes and try again',
    );
    await throttle.hit(rules);
    const user = await findSessionUser(db, { email });
    // The same answer whether or not the address exists; the mail goes out after replying, so
    // neither the body nor a slow or failing mail server tells the two cases apart.
    res.json(FORGOT_ANSWER);
    if (!user) return;
    const { token, hash } = newMailToken();
    await db
      .insertInto('password_resets')
      .values({ user_id: user.id, token_hash: hash, expires_at: new Date(Date.now() + RESET_TTL_MS) })
      .execute();
    const link = `${config.appUrl}/reset/${token}`;
    await recordAudit(db, { workspaceId: user.workspaceId, userId: user.id, action: 'auth.reset_requested' });
    await mailer
      .send({
        to: user.email,
        subject: 'Reset your Sigmatail password',
        text: `Someone asked to reset the password of ${user.email}.\n\nSet a new one here (valid for 1 hour):\n${link}\n\nIf it was not you, ignore this mail.`,
        html: `<p>Someone asked to reset the password of ${user.email}.</p><p><a href="${link}">Set a new password</a> (valid for 1 hour).</p><p>If it was not you, ignore this mail.</p>`,
      })
      .catch((err: Error) => console.error(`reset mail to ${user.email} failed: ${err.message}`));
  });

  router.post('/auth/reset', async (req, res) => {
    const { token, password } = resetBody.parse(req.body ?? {});
    const userId = await countTokenFailures(throttle, config, req, () =>
      db.transaction().execute(async (tx) => {
        // Claiming the row in the update makes a token single-use even under concurrent requests.
        const reset = await tx
          .updateTable('password_resets')
          .set({ used_at: new Date() })
          .where('token_hash', '=', hashToken(token))
          .where('used_at', 'is', null)
          .where('expires_at', '>', new Date())
          .returning('user_id')
          .executeTakeFirst();
        if (!reset) throw new HttpError(400, 'this reset link is invalid, used or expired', 'token');
        const owner = await tx
          .selectFrom('users')
          .select('email')
          .where('id', '=', reset.user_id)
          .executeTakeFirstOrThrow();
        assertPasswordPolicy(password, owner.email); // a refusal rolls back, so the link still works
        const passwordHash = await hashPassword(password);
        // A new password also signs out every existing session.
        await tx
          .updateTable('users')
          .set((eb) => ({ password_hash: passwordHash, session_epoch: eb('session_epoch', '+', 1) }))
          .where('id', '=', reset.user_id)
          .execute();
        await revokeSessions(tx, { everyOf: reset.user_id });
        const member = await findSessionUser(tx, { userId: reset.user_id });
        await recordAudit(tx, {
          workspaceId: member?.workspaceId ?? null,
          userId: reset.user_id,
          action: 'auth.reset',
        });
        return reset.user_id;
      }),
    );
    await sessionCacheFor(db).forgetUser(userId); // older sessions are refused from the next request on
    res.json({ ok: true });
  });

  return router;
}
