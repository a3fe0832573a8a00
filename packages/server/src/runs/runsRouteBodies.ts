import type { RouteBodyTable } from '../http/routeBodies.js';
import { launchRunBody } from './runSchemas.js';

/** Request bodies of the runs routes; see RouteBodyTable. */
export const runsRouteBodies: RouteBodyTable = {
  'POST /api/runs': launchRunBody,
  'POST /api/runs/:id/cancel': null,
};
