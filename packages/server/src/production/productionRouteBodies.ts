import type { RouteBodyTable } from '../http/routeBodies.js';
import { ageingBody, pairingBody, planBody, priceTableBody } from './productionSchemas.js';

/** Request bodies of the production planning routes; see RouteBodyTable. */
export const productionRouteBodies: RouteBodyTable = {
  'PUT /api/prices': priceTableBody,
  'POST /api/plans': planBody,
  'POST /api/pairing': pairingBody,
  'POST /api/ageing': ageingBody,
};
