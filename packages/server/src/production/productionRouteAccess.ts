import type { RouteAccessTable } from '../http/routeAccess.js';

const COMPUTE = ['admin', 'engineer', 'production'] as const;

/** Expected access of every production planning route (read by the role × route matrix test). */
export const productionRouteAccess: RouteAccessTable = {
  'GET /api/prices': 'signedIn',
  'PUT /api/prices': COMPUTE,
  'GET /api/plans': 'signedIn',
  'POST /api/plans': COMPUTE,
  'GET /api/plans/:id': 'signedIn',
  'POST /api/pairing': COMPUTE,
  'GET /api/pairing/latest': 'signedIn',
  'POST /api/ageing': COMPUTE,
  'GET /api/ageing/latest': 'signedIn',
};
