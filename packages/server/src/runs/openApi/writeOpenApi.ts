// Regenerates packages/server/openapi.json: tsx --conditions=@sigmatail/source packages/server/src/runs/openApi/writeOpenApi.ts
import { writeFile } from 'node:fs/promises';
import { buildOpenApi, OPENAPI_FILE } from './openApiFile.js';

await writeFile(OPENAPI_FILE, JSON.stringify(await buildOpenApi(), null, 2) + '\n');
console.log(`wrote ${OPENAPI_FILE}`);
