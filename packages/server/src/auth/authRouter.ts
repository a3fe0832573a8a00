import bcrypt from 'bcryptjs';
import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { emailField, passwordField } from '../http/fields.js';
import { HttpError } from '../http/httpError.js';
import { findSessionUser } from './findSessionUser.js';
import { loginRules, sourceKey } from './authThrottleRules.js';
import { BCRYPT_COST } from './passwordPolicy.js';
import { presentMe } from './presentMe.js';
import { requireAuth } from './requireRole.js';
import { sessionCacheFor } from './sessionCache.js';
import { Throttle } from './throttle.js';
import { clearSessionCookie, revokeSessions, setSessionCookie } from './sessionCookie.js';

export const loginBody = z.object({ email: emailField, password: passwordField });
export const logoutBody = z.object({ everywhere: z.boolean().optional() }).optional();

// Compared against when the email is unknown, so both cases take the same bcrypt time.
const DUMMY_HASH = bcrypt.hashSync('not-a-password', BCRYPT_COST);

/** POST /auth/login, POST /auth/logout, GET /auth/me. */
export function createAuthRouter(deps: AppDeps): Router {
  const { db, config } = deps;
  const router = Router();
  const throttle = new Throttle(db, config.rateLimitScope);

  router.post('/auth/login', async (req, res) => {
    const { email, password } = loginBody.parse(req.body ?? {});
    const rules = loginRules(config, email, sourceKey(req));
    await throttle.check(
      rules,
      'too many failed sign-ins from your address; wait a few minutes and try again',
    );
    const user = await findSessionUser(db, { email });
    const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !ok) {
      await throttle.hit(rules);
      await recordAudit(db, {
        workspaceId: user?.workspaceId ?? null,
        userId: user?.id ?? null,
        action: 'auth.login_failed',
        target: email,
      });
      throw new HttpError(401, 'wrong email or password');
    }
    await throttle.clear([rules[0].key]); // this source's failures on this account are forgiven
    await setSessionCookie(
      res,
      { userId: user.id, workspaceId: user.workspaceId, epoch: user.sessionEpoch },
      config,
      db,
    );
    await recordAudit(db, {
      workspaceId: user.workspaceId,
      userId: user.id,
      action: 'auth.login',
      target: email,
    });
    const { sessionEpoch: _e, passwordHash: _p, ...me } = user;
    res.json(presentMe(me));
  });

  // Public: signing out with an expired or missing session is not an error.
  router.post('/auth/logout', async (req, res) => {
    const body = logoutBody.parse(req.body);
    if (req.user && body?.everywhere) {
      // Voids every token issued so far, on every device.
      await db.transaction().execute(async (tx) => {
        await tx
          .updateTable('users')
          .set((eb) => ({ session_epoch: eb('session_epoch', '+', 1) }))
          .where('id', '=', req.user!.id)
          .execute();
        await revokeSessions(tx, { everyOf: req.user!.id });
      });
    } else if (req.user?.sessionId) {
      await revokeSessions(db, { sessionId: req.user.sessionId });
    }
    // The old cookie is refused from the next request on, by this and every other server process.
    if (req.user) await sessionCacheFor(db).forgetUser(req.user.id);
    if (req.user) {
      await recordAudit(db, {
        workspaceId: req.user.workspaceId,
        userId: req.user.id,
        action: body?.everywhere ? 'auth.logout_everywhere' : 'auth.logout',
      });
    }
    clearSessionCookie(res, config);
    res.status(204).end();
  });

  router.get('/auth/me', requireAuth, (req, res) => {
    res.json(presentMe(req.user!));
  });

  return router;
}
