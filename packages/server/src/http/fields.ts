import { ROLES } from '@sigmatail/db';
import { z } from 'zod';
import { PASSWORD_MIN_LENGTH } from '../auth/passwordPolicy.js';

/** Request field schemas shared by several routes (one definition per field). */
export const emailField = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'must be at most 254 characters')
  .pipe(z.email({ message: 'must be an email address' }));

/**
 * A password as typed (sign-in, or an existing account's password at invite acceptance). New
 * passwords are further checked by assertPasswordPolicy, which needs the account's e-mail.
 */
export const passwordField = z
  .string({ message: 'must be a string' })
  .min(1, 'is required')
  .max(1000, 'must be at most 1000 characters');

/** A new password's length rule (what can be checked without the account; see assertPasswordPolicy). */
export const newPasswordField = z
  .string({ message: 'must be a string' })
  .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
  .refine((s) => new TextEncoder().encode(s).length <= 72, 'must be at most 72 bytes');

export const roleField = z.enum(ROLES, { message: `must be one of ${ROLES.join(', ')}` });

export const nameField = z
  .string()
  .trim()
  .min(1, 'must not be empty')
  .max(120, 'must be at most 120 characters');

export const tokenField = z
  .string()
  .min(16, 'is not a valid link token')
  .max(200, 'is not a valid link token');
