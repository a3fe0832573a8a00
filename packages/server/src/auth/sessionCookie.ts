import type { Database } from '@sigmatail/db';
import type { Response } from 'express';
import type { Kysely } from 'kysely';
import type { AppConfig } from '../config.js';
import { SESSION_COOKIE, signSessionToken, type SessionClaims } from './sessionToken.js';

/**
 * Starts a session: stores its row in `sessions` (so sign-out can revoke it), signs a token naming
 * it and sets it as an httpOnly, SameSite=Lax cookie that expires with the token. Returns the
 * session id.
 */
export async function setSessionCookie(
  res: Response,
  claims: Omit<SessionClaims, 'sessionId'>,
  config: AppConfig,
  db: Kysely<Database>,
): Promise<string> {
  const expiresAt = new Date(Date.now() + config.sessionTtlSeconds * 1000);
  // Old rows of this user go when a new session starts, so the table stays small without a job.
  await db
    .deleteFrom('sessions')
    .where('user_id', '=', claims.userId)
    .where('expires_at', '<', new Date())
    .execute();
  const row = await db
    .insertInto('sessions')
    .values({ user_id: claims.userId, expires_at: expiresAt })
    .returning('id')
    .executeTakeFirstOrThrow();
  const token = await signSessionToken(
    { ...claims, sessionId: row.id },
    config.secret,
    config.sessionTtlSeconds,
  );
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    // Secure when APP_URL is https or this request came over TLS (X-Forwarded-Proto with trust proxy).
    secure: config.cookieSecure || res.req.secure,
    path: '/',
    maxAge: config.sessionTtlSeconds * 1000,
  });
  return row.id;
}

/** Revokes one session (sign-out), or with `everyOf` every session of that user. */
export async function revokeSessions(
  db: Kysely<Database>,
  which: { sessionId: string } | { everyOf: string },
): Promise<void> {
  let q = db.updateTable('sessions').set({ revoked_at: new Date() }).where('revoked_at', 'is', null);
  q = 'sessionId' in which ? q.where('id', '=', which.sessionId) : q.where('user_id', '=', which.everyOf);
  await q.execute();
}

export function clearSessionCookie(res: Response, config: AppConfig): void {
  res.clearCookie(SESSION_COOKIE, {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.cookieSecure || res.req.secure,
    path: '/',
  });
}
