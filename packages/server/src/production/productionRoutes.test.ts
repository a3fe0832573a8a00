import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../runs/testing/exampleDesign.js';
import { uploadLot } from '../testing/uploadLot.js';
import { startTestWorker } from '../runs/testing/startTestWorker.js';
import { buildTeam } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';
import { TEST_DATABASE_URL } from '../testing/testDatabaseUrl.js';

const prices = {
  currency: 'EUR',
  resistors: [5, 2, 1, 0.5].map((tolerance, i) => ({
    kind: 'metal-film',
    tolerance,
    price: [0.03, 0.05, 0.08, 0.2][i],
  })),
  tubes: { unmatched: 14, matched: 19 },
};

let app: TestApp;
let production: TestClient;
let viewer: TestClient;
let outsider: TestClient;
let designId: string;
let worker: { stop(): Promise<void> } | undefined;

beforeAll(async () => {
  process.env.SIGMATAIL_CHUNK_SIZE = '5000';
  app = await startTestApp();
  const team = await buildTeam(app.deps.db);
  production = await signIn(app, team.production);
  viewer = await signIn(app, team.viewer);
  outsider = await signIn(app, (await buildTeam(app.deps.db)).production);
  const engineer = await signIn(app, team.engineer);
  // The example without its frequency specs: those depend on capacitor tolerances, which the
  // price table (resistors and tubes) cannot buy down, so no resistor plan could meet 2000 PPM.
  const doc = exampleDesign() as { specs: { frequency?: number }[] };
  const created = await engineer.post('/api/designs', {
    document: { ...doc, specs: doc.specs.filter((s) => s.frequency === undefined) },
  });
  designId = created.body.design.id;
});
afterAll(async () => {
  delete process.env.SIGMATAIL_CHUNK_SIZE;
  await worker?.stop();
  await app?.close();
});

describe('production planning API', () => {
  it('refuses studies before a price table exists, naming prices', async () => {
    const res = await production.post('/api/plans', { designId, targetPpm: 1000 });
    expect(res.status).toBe(409);
    expect(res.body.error.field).toBe('prices');
  });

  it('keeps a price table per workspace; bad rows are 400 naming the field; viewers read only', async () => {
    const bad = await production.request('PUT', '/api/prices', {
      ...prices,
      resistors: [{ kind: 'wirewound', tolerance: 1, price: 1 }],
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('resistors.0.kind');
    const neg = await production.request('PUT', '/api/prices', {
      ...prices,
      tubes: { unmatched: -1, matched: 2 },
    });
    expect(neg.body.error.field).toBe('tubes.unmatched');
    expect((await viewer.request('PUT', '/api/prices', prices)).status).toBe(403);
    expect((await production.request('PUT', '/api/prices', prices)).status).toBe(200);
    expect((await viewer.get('/api/prices')).body.prices.tubes.matched).toBe(19);
    expect((await outsider.get('/api/prices')).body.prices).toBeNull();
  });

  it('rejects bad plan requests with the field named', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ designId }, 'targetPpm'],
      [{ designId, targetPpm: 1000, targetYield: 99 }, 'targetPpm'],
      [{ designId, targetPpm: -3 }, 'targetPpm'],
      [{ designId, targetYield: 100 }, 'targetYield'],
      [{ designId, targetPpm: 1000, samples: 10 }, 'samples'],
      [{ designId, targetPpm: 1, samples: 1000 }, 'samples'],
      [{ designId, targetPpm: 1000, confirmSamples: 5 }, 'confirmSamples'],
      [{ designId: 'x', targetPpm: 1000 }, 'designId'],
    ];
    for (const [body, field] of cases) {
      const res = await production.post('/api/plans', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.field, JSON.stringify(body)).toBe(field);
    }
  });

  it('searches, saves and confirms a plan; the confirming run lands in the estimate interval', async () => {
    worker = startTestWorker(app.deps.db, TEST_DATABASE_URL, { threads: 1 });
    const res = await production.post('/api/plans', {
      designId,
      targetPpm: 2000,
      samples: 20_000,
      confirmSamples: 20_000,
    });
    expect(res.status).toBe(201);
    const plan = res.body.plan;
    expect(plan.result.chosen.highPpm).toBeLessThanOrEqual(2000);
    expect(plan.result.frontier.length).toBeGreaterThan(0);
    expect(plan.confirmRevision).toBe(2);
    let confirm = plan.confirm;
    for (let i = 0; i < 600 && confirm.status !== 'done'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      confirm = (await viewer.get(`/api/plans/${plan.id}`)).body.plan.confirm;
    }
    expect(confirm.status).toBe('done');
    // Independent estimates (different seeds) of one rate: their 95 % Wilson intervals overlap.
    expect(confirm.lowPpm).toBeLessThanOrEqual(plan.result.chosen.highPpm);
    expect(confirm.highPpm).toBeGreaterThanOrEqual(plan.result.chosen.lowPpm);
    const rev = await viewer.get(`/api/designs/${designId}/revisions/2`);
    expect(rev.body.revision.document.parts.rl1.tolerance).toBe(plan.assignment.classes.rl1);
    expect((await viewer.get(`/api/plans?designId=${designId}`)).body.plans).toHaveLength(1);
    // Another workspace guessing the id sees nothing.
    expect((await outsider.get(`/api/plans/${plan.id}`)).status).toBe(404);
    expect((await outsider.get(`/api/plans`)).body.plans).toEqual([]);
  });

  it('compares pairing strategies and ages a design; latest results per design; isolation by id guessing', async () => {
    const bad = await production.post('/api/pairing', {
      designId,
      strategies: [{ kind: 'matched', quantity: 'ia', within: 0 }],
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('strategies.0.within');
    const pairing = await production.post('/api/pairing', {
      designId,
      samples: 4000,
      strategies: [
        { kind: 'unmatched' },
        { kind: 'matched', quantity: 'gm', within: 10 },
        { kind: 'binned', quantity: 'ia', width: 10, bins: 5 },
      ],
    });
    expect(pairing.status).toBe(201);
    expect(pairing.body.study.result.outcomes).toHaveLength(3);
    expect((await viewer.get(`/api/pairing/latest?designId=${designId}`)).body.study.id).toBe(
      pairing.body.study.id,
    );
    const badLot = await production.post('/api/pairing', {
      designId,
      strategies: [{ kind: 'unmatched' }],
      lot: {
        quantity: 'ia',
        sections: [
          [1.2, 1.1],
          [1.3, 0],
        ],
      },
    });
    expect(badLot.body.error.field).toBe('lot.sections.1.1');
    const fromLot = await production.post('/api/pairing', {
      designId,
      samples: 2000,
      strategies: [{ kind: 'matched', quantity: 'ia', within: 5 }],
      lot: {
        quantity: 'ia',
        sections: [
          [1.2, 1.18],
          [1.0, 1.3],
          [1.1, 1.12],
          [0.9, 0.91],
        ],
      },
    });
    expect(fromLot.status).toBe(201);
    expect(fromLot.body.study.result.lotSize).toBe(4);
    expect(fromLot.body.study.result.outcomes[0].lotAcceptance).toBe(0.75);
    // A stored tube lot (uploaded as CSV) by id: every envelope kept whole, both quantities measured.
    const rows = Array.from({ length: 30 }, (_, i) => {
      const c1 = 1 + 0.08 * Math.sin(i);
      const c2 = c1 * (1 + 0.06 * Math.cos(3 * i));
      return [1.2 * c1, 1.6 * c1, 1.2 * c2, 1.6 * c2].map((v) => v.toFixed(5)).join(',');
    });
    const stored = await uploadLot(
      production,
      { name: 'Pairing lot', kind: 'tube', quantity: 'ia-gm', tubeType: '12AX7' },
      'ia1,gm1,ia2,gm2\n' + rows.join('\n'),
    );
    expect(stored.status).toBe(201);
    const byId = await production.post('/api/pairing', {
      designId,
      samples: 2000,
      strategies: [{ kind: 'unmatched' }, { kind: 'matched', quantity: 'gm', within: 3 }],
      lotId: stored.body.lot.id,
    });
    expect(byId.status).toBe(201);
    expect(byId.body.study.result.lotSize).toBe(30);
    const kept = byId.body.study.result.outcomes[1].lotAcceptance;
    expect(kept).toBeGreaterThan(0);
    expect(kept).toBeLessThan(1);
    const both = await production.post('/api/pairing', {
      designId,
      strategies: [{ kind: 'unmatched' }],
      lotId: stored.body.lot.id,
      lot: { quantity: 'ia', sections: [[1, 1]] },
    });
    expect(both.body.error.field).toBe('lotId');
    const guessed = await production.post('/api/pairing', {
      designId,
      strategies: [{ kind: 'unmatched' }],
      lotId: '00000000-0000-4000-8000-000000000000',
    });
    expect([guessed.status, guessed.body.error.field]).toEqual([404, 'lotId']);
    const ageing = await production.post('/api/ageing', { designId, samples: 3000 });
    expect(ageing.status).toBe(201);
    expect(ageing.body.study.result.aged.specs.length).toBe(4);
    const badAge = await production.post('/api/ageing', {
      designId,
      scenario: { name: 'x', resistors: {}, emission: {} },
    });
    expect(badAge.status).toBe(400);
    expect(badAge.body.error.field).toMatch(/^scenario\./);
    expect((await outsider.get(`/api/ageing/latest?designId=${designId}`)).status).toBe(404);
    expect((await outsider.post('/api/ageing', { designId })).status).toBe(404);
    expect((await viewer.post('/api/ageing', { designId })).status).toBe(403);
  });
});
