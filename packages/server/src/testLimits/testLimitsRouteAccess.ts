import type { RouteAccessTable } from '../http/routeAccess.js';

/** Expected access of the test-limits calculator (read by the role × route matrix test). */
export const testLimitsRouteAccess: RouteAccessTable = {
  'POST /api/test-limits': 'signedIn',
};
