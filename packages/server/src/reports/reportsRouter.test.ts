import crypto from 'node:crypto';
import { cpkInterval } from '@sigmatail/engine';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../runs/testing/exampleDesign.js';
import { startTestWorker } from '../runs/testing/startTestWorker.js';
import { buildTeam, type BuiltUser } from '../testing/buildUser.js';
import { readMail } from '../testing/readMail.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';
import { TEST_DATABASE_URL } from '../testing/testDatabaseUrl.js';

let app: TestApp;
let team: Record<'admin' | 'engineer' | 'production' | 'viewer', BuiltUser>;
let production: TestClient;
let viewer: TestClient;
let designId: string;
let runId: string;

beforeAll(async () => {
  process.env.SIGMATAIL_CHUNK_SIZE = '1000';
  app = await startTestApp();
  team = await buildTeam(app.deps.db);
  const engineer = await signIn(app, team.engineer);
  production = await signIn(app, team.production);
  viewer = await signIn(app, team.viewer);
  const created = await engineer.post('/api/designs', { document: exampleDesign() });
  designId = created.body.design.id;
  const launched = await production.post('/api/runs', {
    designId,
    samples: 2_000,
    seed: 'report',
    plan: 'random',
    analyses: { influence: false, varianceIndices: false, worstCase: false },
  });
  runId = launched.body.id;
  const worker = startTestWorker(app.deps.db, TEST_DATABASE_URL);
  try {
    for (let i = 0; i < 600; i++) {
      if ((await viewer.get(`/api/runs/${runId}`)).body.run.status === 'done') break;
      await new Promise((r) => setTimeout(r, 50));
    }
  } finally {
    await worker.stop();
  }
});
afterAll(async () => {
  delete process.env.SIGMATAIL_CHUNK_SIZE;
  await app?.close();
});

describe('production report', () => {
  it('gathers yield, PPM and Cpk with intervals from the latest finished run', async () => {
    const res = await viewer.get(`/api/reports/${designId}`);
    expect(res.status).toBe(200);
    const { report } = res.body;
    const { results } = (await viewer.get(`/api/runs/${runId}/results`)).body;
    expect(report.design).toMatchObject({
      id: designId,
      revision: 1,
      topology: 'cap-coupled',
      tube: '12AX7',
    });
    expect(report.run.id).toBe(runId);
    expect(report.run.joint).toEqual({
      yield: results.joint.yield,
      wilson: results.joint.wilson,
      clopperPearson: results.joint.clopperPearson,
      ppm: results.joint.ppm,
    });
    expect(report.run.specs.length).toBe(results.specs.length);
    const s0 = results.specs[0];
    expect(report.run.specs[0].cpkInterval).toEqual(cpkInterval(s0.cpk, s0.samples)); // as the results page shows it
  });

  it('shows the plan, pairing, ageing and test limits saved for the design', async () => {
    const empty = (await viewer.get(`/api/reports/${designId}`)).body.report;
    expect([empty.plan, empty.pairing, empty.ageing, empty.limits]).toEqual([null, null, null, null]);

    const prices = {
      currency: 'EUR',
      resistors: [5, 1].map((tolerance, i) => ({ kind: 'metal-film', tolerance, price: [0.03, 0.08][i] })),
      tubes: { unmatched: 14, matched: 19 },
    };
    expect((await production.request('PUT', '/api/prices', prices)).status).toBe(200);
    const plan = await production.post('/api/plans', { designId, targetPpm: 20_000, samples: 4_000 });
    expect(plan.status).toBe(201);
    const strategies = [{ kind: 'unmatched' }, { kind: 'matched', quantity: 'gm', within: 10 }];
    expect((await production.post('/api/pairing', { designId, samples: 2_000, strategies })).status).toBe(
      201,
    );
    expect((await production.post('/api/ageing', { designId, samples: 2_000 })).status).toBe(201);
    const limitsBody = {
      process: { runId, metric: 'balanceDb' },
      measurementSd: 0.05,
      spec: { low: -0.5, high: 0.5 },
      targetFalseAcceptPpm: 100,
      save: true,
    };
    expect((await viewer.post('/api/test-limits', limitsBody)).status).toBe(403);
    const given = await production.post('/api/test-limits', {
      ...limitsBody,
      process: { mean: 0, sd: 0.2 },
    });
    expect(given.status).toBe(400);
    expect(given.body.error.field).toBe('save');
    const limits = await production.post('/api/test-limits', limitsBody);
    expect(limits.status).toBe(200);
    expect(limits.body.saved.id).toMatch(/^[0-9a-f-]{36}$/);

    const { report } = (await viewer.get(`/api/reports/${designId}`)).body;
    expect(report.plan.id).toBe(plan.body.plan.id);
    expect(report.plan.targetPpm).toBe(20_000);
    expect(report.pairing.strategies.map((x: { label: string }) => x.label)).toEqual([
      'Unmatched',
      'Matched: gm within ± 10 %',
    ]);
    expect(report.ageing.specs.length).toBeGreaterThan(0);
    expect(report.limits).toMatchObject({ metric: 'balanceDb', measurementSd: 0.05 });
    expect(report.limits.falseAcceptPpm).toBeCloseTo(limits.body.rates.falseAccept * 1e6, 6);

    const to = `planner-${crypto.randomBytes(3).toString('hex')}@fixture.example`;
    expect((await production.post(`/api/reports/${designId}/email`, { to })).status).toBe(200);
    const mail = await readMail(app.deps.db, to);
    expect(mail.text).toContain('Tolerance plan (target 20,000 PPM)');
    expect(mail.text).toContain('Pairing: Matched: gm within ± 10 %');
    expect(mail.text).toContain('Reject rate new / aged');
    expect(mail.text).toContain('Test limits (balanceDb)');
  });

  it('is mailed by production to a colleague and lands in the inbox with the figures and the caution', async () => {
    const to = `colleague-${crypto.randomBytes(3).toString('hex')}@fixture.example`;
    const res = await production.post(`/api/reports/${designId}/email`, { to, note: 'For Friday <3' });
    expect(res.status).toBe(200);
    const mail = await readMail(app.deps.db, to);
    expect(mail.subject).toMatch(/production report/);
    expect(mail.text).toContain('Joint yield');
    expect(mail.text).toContain(`/production/report/${designId}`);
    expect(mail.text).toMatch(/High voltage/);
    expect(mail.html).toContain('For Friday &#60;3'); // user text is escaped in HTML
    const audit = await app.deps.db
      .selectFrom('audit_events')
      .select(['action', 'detail'])
      .where('target', '=', designId)
      .where('action', '=', 'report.email')
      .orderBy('at', 'desc')
      .executeTakeFirstOrThrow();
    expect(audit.detail).toMatchObject({ to, runId });
  });

  it('refuses bad input naming the field, viewers, and other workspaces', async () => {
    const bad = await production.post(`/api/reports/${designId}/email`, { to: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('to');
    const extra = await production.post(`/api/reports/${designId}/email`, { to: 'a@b.example', cc: 'x' });
    expect(extra.status).toBe(400);
    expect((await viewer.post(`/api/reports/${designId}/email`, { to: 'a@b.example' })).status).toBe(403);
    expect((await viewer.get('/api/reports/not-a-uuid')).status).toBe(404);
    expect((await viewer.get(`/api/reports/${crypto.randomUUID()}`)).status).toBe(404);
    const stranger = await signIn(app, (await buildTeam(app.deps.db)).production);
    expect((await stranger.get(`/api/reports/${designId}`)).status).toBe(404);
    expect((await stranger.post(`/api/reports/${designId}/email`, { to: 'a@b.example' })).status).toBe(404);
  });
});
