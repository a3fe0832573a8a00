import { MAX_LOT_BYTES, MAX_LOT_ROWS } from '@sigmatail/engine';
import { z } from 'zod';
import { testLimitsBody } from '../testLimits/testLimitsRouter.js';
import { applyBody, uploadFields } from './lotsRouter.js';

const json = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' });
const errorRef = { $ref: '#/components/schemas/Error' };
const error = (description: string) => ({
  description,
  content: { 'application/json': { schema: errorRef } },
});
const ok = (description = 'OK') => ({
  description,
  content: { 'application/json': { schema: { type: 'object' } } },
});

/** One-line summaries of the lots and test-limits routes. */
export const lotsSummaries: Record<string, string> = {
  'GET /api/lots': 'Measured lots of the workspace',
  'POST /api/lots': 'Upload a lot (multipart CSV); every row is checked, nothing is stored half-way',
  'GET /api/lots/:id':
    'A lot with count, mean, sd, quantiles, histogram, normal/lognormal fits and the binned verdict',
  'DELETE /api/lots/:id': 'Delete a lot (designs keep the values they embedded)',
  'POST /api/lots/:id/apply': 'Embed the lot in a design as a part or tube spread (a new revision)',
  'POST /api/test-limits': 'False-accept / false-reject rates of test limits and a suggested guard band',
};

/** Request and response details of the lots and test-limits routes. */
export const lotsDetails: Record<string, object> = {
  'POST /api/lots': {
    requestBody: {
      required: true,
      content: {
        'multipart/form-data': {
          schema: {
            type: 'object',
            properties: {
              file: {
                type: 'string',
                format: 'binary',
                description: `CSV with a header row, at most ${MAX_LOT_BYTES} bytes and ${MAX_LOT_ROWS} rows. Resistor: column value (ohms or RKM). Tube: ia1,gm1,ia2,gm2 (mA, mA/V) or mu1,rp1,mu2,rp2.`,
              },
              fields: json(uploadFields),
            },
            required: ['file', 'name', 'kind'],
          },
        },
      },
    },
    responses: {
      201: ok('Stored'),
      400: error('A bad field, or row errors: error.issues paths are rows.<line>.<column>'),
      413: error('File too large'),
      415: error('Not multipart/form-data'),
    },
  },
  'POST /api/lots/:id/apply': {
    requestBody: { required: true, content: { 'application/json': { schema: json(applyBody) } } },
    responses: {
      201: ok('New revision'),
      404: error('Lot or design not found'),
      409: error('Design archived'),
    },
  },
  'GET /api/lots/:id': { responses: { 200: ok(), 404: error('Lot not found') } },
  'DELETE /api/lots/:id': { responses: { 204: { description: 'Deleted' }, 404: error('Lot not found') } },
  'POST /api/test-limits': {
    requestBody: { required: true, content: { 'application/json': { schema: json(testLimitsBody) } } },
    responses: { 200: ok(), 404: error('Run not found'), 409: error('Run has no results') },
  },
};
