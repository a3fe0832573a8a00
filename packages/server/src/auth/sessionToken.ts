import { jwtVerify, SignJWT } from 'jose';

/**
 * What a session token carries: who, in which workspace, the user's session epoch when issued,
 * and the id of its row in `sessions` (sid; signing out revokes that row).
 */
export interface SessionClaims {
  userId: string;
  workspaceId: string;
  epoch: number;
  sessionId: string;
}

export const SESSION_COOKIE = 'sigmatail_session';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

const key = (secret: string): Uint8Array => new TextEncoder().encode(secret);

/** Signs an HS256 JWT that expires `ttlSeconds` from now. */
export async function signSessionToken(
  claims: SessionClaims,
  secret: string,
  ttlSeconds: number,
): Promise<string> {
  return new SignJWT({ ws: claims.workspaceId, ep: claims.epoch, sid: claims.sessionId })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(claims.userId)
    .setIssuedAt()
    .setExpirationTime(Math.floor(Date.now() / 1000) + ttlSeconds)
    .sign(key(secret));
}

/**
 * The claims of a valid, unexpired token and when it expires (epoch ms), or null (bad signature,
 * expired, malformed).
 */
export async function verifySessionToken(
  token: string,
  secret: string,
): Promise<(SessionClaims & { expiresAt: number }) | null> {
  try {
    const { payload } = await jwtVerify(token, key(secret), { algorithms: ['HS256'] });
    if (
      typeof payload.sub !== 'string' ||
      typeof payload.ws !== 'string' ||
      typeof payload.ep !== 'number' ||
      typeof payload.sid !== 'string' ||
      !UUID.test(payload.sid)
    ) {
      return null;
    }
    return {
      userId: payload.sub,
      workspaceId: payload.ws,
      epoch: payload.ep,
      sessionId: payload.sid,
      expiresAt: typeof payload.exp === 'number' ? payload.exp * 1000 : Infinity,
    };
  } catch {
    return null;
  }
}
