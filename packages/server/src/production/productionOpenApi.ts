import { z } from 'zod';
import { ageingBody, pairingBody, planBody, priceTableBody } from './productionSchemas.js';

const json = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' });
const errorRef = { $ref: '#/components/schemas/Error' };
const errorResponse = (description: string) => ({
  description,
  content: { 'application/json': { schema: errorRef } },
});
const body = (schema: z.ZodType) => ({
  required: true,
  content: { 'application/json': { schema: json(schema) } },
});
const ok = (description: string, properties: Record<string, object>) => ({
  description,
  content: { 'application/json': { schema: { type: 'object', properties } } },
});
const designQuery = (required: boolean) => [
  { name: 'designId', in: 'query', required, schema: { type: 'string', format: 'uuid' } },
];
const study = {
  study: { type: 'object', description: 'id, designId, revision, kind, input, result, createdAt' },
};

/** One-line summaries of the production planning routes. */
export const productionSummaries: Record<string, string> = {
  'GET /api/prices': 'The workspace price table (resistors by kind and class, tubes unmatched and matched)',
  'PUT /api/prices': 'Replace the workspace price table',
  'GET /api/plans': 'Saved tolerance plans, newest first (filter by designId)',
  'POST /api/plans':
    'Search the cheapest tolerance plan meeting a target, save it and launch its confirming run',
  'GET /api/plans/:id': 'A saved plan: target, frontier, chosen assignment, confirming run and its interval',
  'POST /api/pairing': 'Compare pairing strategies for a design (saved)',
  'GET /api/pairing/latest': 'The latest saved pairing comparison of a design',
  'POST /api/ageing': 'Apply an ageing scenario to a design: new and aged side by side (saved)',
  'GET /api/ageing/latest': 'The latest saved ageing result of a design',
};

/** Request and response details of the production planning routes, from their zod schemas. */
export const productionDetails: Record<string, object> = {
  'GET /api/prices': {
    responses: { 200: ok('The table, or null when none is set', { prices: { type: ['object', 'null'] } }) },
  },
  'PUT /api/prices': {
    requestBody: body(priceTableBody),
    responses: { 200: ok('Saved', { prices: json(priceTableBody) }) },
  },
  'GET /api/plans': {
    parameters: designQuery(false),
    responses: { 200: ok('Plans', { plans: { type: 'array' } }) },
  },
  'POST /api/plans': {
    requestBody: body(planBody),
    responses: {
      201: ok('Saved plan', { plan: { type: 'object' } }),
      404: errorResponse('Design or revision not found'),
      409: errorResponse('No price table yet, or the design is archived'),
    },
  },
  'GET /api/plans/:id': { responses: { 200: ok('The plan', { plan: { type: 'object' } }) } },
  'POST /api/pairing': {
    requestBody: body(pairingBody),
    responses: { 201: ok('Saved comparison', study), 409: errorResponse('No price table yet') },
  },
  'GET /api/pairing/latest': {
    parameters: designQuery(true),
    responses: { 200: ok('Latest comparison', study), 404: errorResponse('None saved') },
  },
  'POST /api/ageing': { requestBody: body(ageingBody), responses: { 201: ok('Saved result', study) } },
  'GET /api/ageing/latest': {
    parameters: designQuery(true),
    responses: { 200: ok('Latest ageing result', study), 404: errorResponse('None saved') },
  },
};
