import type { Role } from '@sigmatail/db';
import type { RequestHandler } from 'express';
import { HttpError } from '../http/httpError.js';

/** The signed-in user of a request, as loaded (fresh from the database) by loadSession. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  workspaceId: string;
  workspaceName: string;
  role: Role;
  /** The session (row in `sessions`) this request is signed in with; absent on users not loaded from a cookie. */
  sessionId?: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      user?: SessionUser;
    }
  }
}

/** 401 unless someone is signed in. */
export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(new HttpError(401, 'sign in first'));
  next();
};

/**
 * 401 when nobody is signed in, 403 when the user's role in the workspace is not listed.
 * admin passes every check (admins may do everything).
 * @example router.post('/designs', requireRole('engineer'), handler)
 */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new HttpError(401, 'sign in first'));
    if (req.user.role !== 'admin' && !roles.includes(req.user.role)) {
      return next(new HttpError(403, `this needs the ${roles.join(' or ') || 'admin'} role`));
    }
    next();
  };
}
