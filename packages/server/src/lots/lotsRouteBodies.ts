import type { RouteBodyTable } from '../http/routeBodies.js';
import { testLimitsBody } from '../testLimits/testLimitsRouter.js';
import { applyBody } from './lotsRouter.js';

/** Request bodies of the lots and test-limits routes; see RouteBodyTable. */
export const lotsRouteBodies: RouteBodyTable = {
  // A multipart upload, not JSON: its form fields are described in lotsOpenApi.ts.
  'POST /api/lots': null,
  'DELETE /api/lots/:id': null,
  'POST /api/lots/:id/apply': applyBody,
  'POST /api/test-limits': testLimitsBody,
};
