import bcrypt from 'bcryptjs';
import { HttpError } from '../http/httpError.js';
import { COMMON_PASSWORDS } from './commonPasswords.js';

/** bcrypt work factor for stored passwords (2^10 rounds, ~70 ms here; common practice, no source). */
export const BCRYPT_COST = 10;

/** Shortest new password (characters): common practice, no source. */
export const PASSWORD_MIN_LENGTH = 10;

/** Hashes a new password at BCRYPT_COST. */
export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

/**
 * Checks a new password (set by invite acceptance or reset) against the policy: at least
 * PASSWORD_MIN_LENGTH characters, at most 72 bytes (all bcrypt reads), not the account's e-mail or
 * its name part, not a commonly used password. Throws 400 naming the field `password`.
 */
export function assertPasswordPolicy(password: string, email: string): void {
  const fail = (why: string): never => {
    throw new HttpError(400, `password: ${why}`, 'password');
  };
  if ([...password].length < PASSWORD_MIN_LENGTH) fail(`must be at least ${PASSWORD_MIN_LENGTH} characters`);
  if (new TextEncoder().encode(password).length > 72) fail('must be at most 72 bytes');
  const p = password.trim().toLowerCase();
  const e = email.trim().toLowerCase();
  const local = e.split('@')[0] ?? '';
  if (p === e || (local.length >= 4 && p.includes(local))) fail('must not contain your e-mail address');
  if (COMMON_PASSWORDS.has(p) || new Set(p).size <= 2)
    fail('is too common; choose a longer or less usual one');
}
