import { readFile } from 'node:fs/promises';
import { createDb } from '@sigmatail/db';
import { describe, expect, it } from 'vitest';
import { createApp } from '../../app.js';
import { DEFAULT_CONFIG } from '../../config.js';
import { listApiRoutes } from '../../http/listApiRoutes.js';
import { TEST_DATABASE_URL } from '../../testing/testDatabaseUrl.js';
import { buildOpenApi, OPENAPI_FILE } from './openApiFile.js';

describe('OpenAPI document', () => {
  it('lists exactly the routes the app registers, each with its method', async () => {
    const db = createDb(TEST_DATABASE_URL, { max: 1 }); // never queried: only the routes are read
    const app = createApp({
      db,
      mailer: { send: async () => {}, close: () => {} },
      config: { ...DEFAULT_CONFIG, secret: 'x'.repeat(32) },
    });
    const registered = listApiRoutes(app).sort();
    await db.destroy();
    const doc = (await buildOpenApi()) as { paths: Record<string, Record<string, unknown>> };
    const documented = Object.entries(doc.paths)
      .flatMap(([p, ops]) =>
        Object.keys(ops).map((m) => `${m.toUpperCase()} ${p.replace(/\{([A-Za-z]+)\}/g, ':$1')}`),
      )
      .sort();
    expect(documented).toEqual(registered);
  });

  it('is committed as packages/server/openapi.json, up to date', async () => {
    const committed = JSON.parse(await readFile(OPENAPI_FILE, 'utf8')) as unknown;
    expect(
      committed,
      'regenerate with: npx tsx --conditions=@sigmatail/source packages/server/src/runs/openApi/writeOpenApi.ts',
    ).toEqual(await buildOpenApi());
  });

  it('describes the launch body from the same schema the route validates with', async () => {
    const doc = (await buildOpenApi()) as {
      components: {
        schemas: { LaunchRun: { required: string[]; properties: Record<string, { maximum?: number }> } };
      };
    };
    const launch = doc.components.schemas.LaunchRun;
    expect(launch.required.sort()).toEqual(['designId', 'plan', 'samples']);
    expect(launch.properties.samples!.maximum).toBe(100_000_000);
  });
});
