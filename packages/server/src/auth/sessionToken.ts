import { jwtVerify, SignJWT } from 'jose';

/** What a session token carries: who, in which workspace, and the user's session epoch when issued. */
export interface SessionClaims {
  userId: string;
  workspaceId: string;
  epoch: number;
}

export const SESSION_COOKIE = 'sigmatail_session';

const key = (secret: string): Uint8Array => new TextEncoder().encode(secret);

/** Signs an HS256 JWT that expires `ttlSeconds` from now. */
export async function signSessionToken(
  claims: SessionClaims,
  secret: string,
  ttlSeconds: number,
): Promise<string> {
  return new SignJWT({ ws: claims.workspaceId, ep: claims.epoch })
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
    if (typeof payload.sub !== 'string' || typeof payload.ws !== 'string' || typeof payload.ep !== 'number') {
      return null;
    }
    return {
      userId: payload.sub,
      workspaceId: payload.ws,
      epoch: payload.ep,
      expiresAt: typeof payload.exp === 'number' ? payload.exp * 1000 : Infinity,
    };
  } catch {
    return null;
  }
}
