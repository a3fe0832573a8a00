import { fileURLToPath } from 'node:url';

export { buildOpenApi } from './buildOpenApi.js';
/** Where the committed OpenAPI document lives (packages/server/openapi.json). */
export const OPENAPI_FILE = fileURLToPath(new URL('../../../openapi.json', import.meta.url));
