import type { RouteAccessTable } from '../http/routeAccess.js';

/** Expected access of every runs route (read by the role × route matrix test). */
export const runsRouteAccess: RouteAccessTable = {
  'POST /api/runs': ['admin', 'engineer', 'production'],
  'GET /api/runs': 'signedIn',
  'GET /api/runs/:id': 'signedIn',
  'POST /api/runs/:id/cancel': ['admin', 'engineer', 'production'],
  'GET /api/runs/:id/results': 'signedIn',
  'GET /api/runs/:id/samples': 'signedIn',
  'GET /api/runs/:id/export.csv': ['admin', 'engineer', 'production'],
  'GET /api/runs/:id/export.json': ['admin', 'engineer', 'production'],
  'GET /api/openapi.json': 'public',
};
