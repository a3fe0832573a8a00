import type { RouteAccessTable } from '../http/routeAccess.js';

/** Expected access of every lots route (read by the role × route matrix test). */
export const lotsRouteAccess: RouteAccessTable = {
  'GET /api/lots': 'signedIn',
  'POST /api/lots': ['admin', 'engineer', 'production'],
  'GET /api/lots/:id': 'signedIn',
  'DELETE /api/lots/:id': ['admin', 'engineer', 'production'],
  'POST /api/lots/:id/apply': ['admin', 'engineer', 'production'],
};
