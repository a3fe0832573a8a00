import type { Response } from 'express';
import type { AppConfig } from '../config.js';
import { SESSION_COOKIE, signSessionToken, type SessionClaims } from './sessionToken.js';

/** Signs a session token and sets it as an httpOnly, SameSite=Lax cookie that expires with the token. */
export async function setSessionCookie(
  res: Response,
  claims: SessionClaims,
  config: AppConfig,
): Promise<void> {
  const token = await signSessionToken(claims, config.secret, config.sessionTtlSeconds);
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.cookieSecure,
    path: '/',
    maxAge: config.sessionTtlSeconds * 1000,
  });
}

export function clearSessionCookie(res: Response, config: AppConfig): void {
  res.clearCookie(SESSION_COOKIE, {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.cookieSecure,
    path: '/',
  });
}
