import type { RouteAccessTable } from './http/routeAccess.js';

/**
 * Expected access of every foundation route. The role matrix test (apiRoutes.test.ts) reads this
 * and every other `*RouteAccess.ts` table under src/, and fails for any route without an entry.
 */
export const foundationRouteAccess: RouteAccessTable = {
  'GET /api/health': 'public',
  'POST /api/auth/login': 'public',
  'POST /api/auth/logout': 'public',
  'GET /api/auth/me': 'signedIn',
  'GET /api/auth/workspaces': 'signedIn',
  'POST /api/auth/workspace': 'signedIn',
  'POST /api/auth/forgot': 'public',
  'POST /api/auth/reset': 'public',
  'GET /api/invites/:token': 'public',
  'POST /api/auth/accept-invite': 'public',
  'POST /api/invites': ['admin'],
  'DELETE /api/invites/:id': ['admin'],
  'GET /api/users': ['admin'],
  'PATCH /api/users/:id': ['admin'],
  'DELETE /api/users/:id': ['admin'],
  'GET /api/workspace': 'signedIn',
  'PATCH /api/workspace': ['admin'],
  'GET /api/dev/inbox': ['admin'],
  'GET /api/dev/inbox/:id': ['admin'],
  'GET /api/audit': ['admin'],
  'GET /api/designs': 'signedIn',
  'POST /api/designs': ['admin', 'engineer'],
  'GET /api/designs/:id': 'signedIn',
  'GET /api/designs/:id/revisions': 'signedIn',
  'GET /api/designs/:id/revisions/:rev': 'signedIn',
  'POST /api/designs/:id/revisions': ['admin', 'engineer'],
  'POST /api/designs/:id/archive': ['admin', 'engineer'],
};
