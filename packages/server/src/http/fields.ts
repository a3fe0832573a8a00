import { ROLES } from '@sigmatail/db';
import { z } from 'zod';

/** Request field schemas shared by several routes (one definition per field). */
export const emailField = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'must be at most 254 characters')
  .pipe(z.email({ message: 'must be an email address' }));

/** New passwords: long enough to resist guessing; bcrypt reads at most 72 bytes. */
export const newPasswordField = z
  .string()
  .min(8, 'must be at least 8 characters')
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
