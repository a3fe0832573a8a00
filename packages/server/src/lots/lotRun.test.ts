import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../runs/testing/exampleDesign.js';
import { startTestWorker } from '../runs/testing/startTestWorker.js';
import { buildTeam } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';
import { TEST_DATABASE_URL } from '../testing/testDatabaseUrl.js';

// The whole path: a lot uploaded through the API, applied to a design, run by a worker; the run's
// sampled part values (regenerated for the CSV export) have the lot's mean and sd.

let app: TestApp;
let production: TestClient;
let designId: string;
let worker: { stop(): Promise<void> } | undefined;

beforeAll(async () => {
  process.env.SIGMATAIL_CHUNK_SIZE = '2000';
  app = await startTestApp();
  const team = await buildTeam(app.deps.db);
  production = await signIn(app, team.production);
  const engineer = await signIn(app, team.engineer);
  designId = (await engineer.post('/api/designs', { document: exampleDesign() })).body.design.id;
  worker = startTestWorker(app.deps.db, TEST_DATABASE_URL, { threads: 1 });
});
afterAll(async () => {
  delete process.env.SIGMATAIL_CHUNK_SIZE;
  await worker?.stop();
  await app?.close();
});

async function upload(fields: Record<string, string>, csv: string) {
  const fd = new FormData();
  for (const [k, v] of Object.entries(fields)) fd.append(k, v);
  fd.append('file', new Blob([csv], { type: 'text/csv' }), 'lot.csv');
  const res = await fetch(`${production.baseUrl}/api/lots`, {
    method: 'POST',
    headers: { cookie: production.cookie! },
    body: fd,
  });
  expect(res.status).toBe(201);
  return (
    (await res.json()) as { lot: { id: string; quantities: { summary: { mean: number; sd: number } }[] } }
  ).lot;
}

const moments = (x: number[]) => {
  const mean = x.reduce((a, b) => a + b, 0) / x.length;
  return { mean, sd: Math.sqrt(x.reduce((a, b) => a + (b - mean) ** 2, 0) / (x.length - 1)) };
};

describe('a lot used in a run', () => {
  it("gives sampled Rk values with the lot's mean and sd, and whole tubes from the tube lot", async () => {
    // Rk: 250 parts around 470 Ω, skewed (a lot the normal would not describe).
    const values = Array.from({ length: 250 }, (_, i) => 465 + 8 * ((i * 0.618034) % 1) ** 2);
    const rkLot = await upload({ name: 'Rk run lot', kind: 'resistor' }, 'value\n' + values.join('\n'));
    const tubes = Array.from({ length: 60 }, (_, i) => {
      const c = 1 + 0.12 * Math.sin(i * 1.3);
      const d = 1 + 0.03 * Math.cos(i * 2.1);
      return [1.2 * c, 1.6 * c, 1.2 * c * d, 1.6 * c * d].map((v) => v.toFixed(5)).join(',');
    });
    const tubeLot = await upload(
      { name: 'Tube run lot', kind: 'tube', quantity: 'ia-gm', tubeType: '12AX7' },
      'ia1,gm1,ia2,gm2\n' + tubes.join('\n'),
    );
    expect((await production.post(`/api/lots/${rkLot.id}/apply`, { designId, target: 'rk' })).status).toBe(
      201,
    );
    const applied = await production.post(`/api/lots/${tubeLot.id}/apply`, { designId, target: 'tube' });
    expect(applied.status).toBe(201);

    const launch = await production.post('/api/runs', {
      designId,
      samples: 10_000,
      seed: 'lot-run',
      plan: 'random',
      analyses: { influence: false, varianceIndices: false, worstCase: false },
    });
    expect(launch.status).toBe(202);
    const id = launch.body.id as string;
    for (let i = 0; i < 600; i++) {
      const r = await production.get(`/api/runs/${id}`);
      if (['done', 'failed', 'cancelled'].includes(r.body.run.status)) break;
      await new Promise((res) => setTimeout(res, 100));
    }
    expect((await production.get(`/api/runs/${id}`)).body.run.status).toBe('done');
    const csv = await production.get(`/api/runs/${id}/export.csv`);
    const rows = parse(csv.body as string, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(10_000);
    const rk = rows.map((r) => Number(r.rk));
    const got = moments(rk);
    const lot = rkLot.quantities[0]!.summary;
    expect(Math.abs(got.mean - lot.mean)).toBeLessThan((4 * lot.sd) / Math.sqrt(rk.length));
    expect(Math.abs(got.sd - lot.sd)).toBeLessThan((5 * lot.sd) / Math.sqrt(2 * rk.length));
    // Every sampled envelope is one of the lot's tubes: perv2/perv1 takes only the lot's 60 ratios.
    const ratios = new Set(rows.map((r) => (Number(r.perv2) / Number(r.perv1)).toFixed(6)));
    expect(ratios.size).toBeLessThanOrEqual(60);
  });
});
