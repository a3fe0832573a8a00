import type { RouteBodyTable } from '../http/routeBodies.js';
import { emailReportBody } from './reportsRouter.js';

/** Request bodies of the reports routes; see RouteBodyTable. */
export const reportsRouteBodies: RouteBodyTable = {
  'POST /api/reports/:designId/email': emailReportBody,
};
