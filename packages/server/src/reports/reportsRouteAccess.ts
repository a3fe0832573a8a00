import type { RouteAccessTable } from '../http/routeAccess.js';

/** Expected access of every reports route (read by the role × route matrix test). */
export const reportsRouteAccess: RouteAccessTable = {
  'GET /api/reports/:designId': 'signedIn',
  'POST /api/reports/:designId/email': ['admin', 'engineer', 'production'],
};
