import { createHash, randomBytes } from 'node:crypto';

/** SHA-256 hex of a mailed token; only this is stored, so a database leak reveals no live link. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A fresh 256-bit URL-safe token and its hash. */
export function newMailToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}
