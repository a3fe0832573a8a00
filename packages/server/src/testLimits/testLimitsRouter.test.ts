import { testLimitRates } from '@sigmatail/engine';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser, type BuiltUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';

let app: TestApp;
let viewer: TestClient;
let viewerUser: BuiltUser;
beforeAll(async () => {
  app = await startTestApp();
  viewerUser = await buildUser(app.deps.db, { role: 'viewer' });
  viewer = await signIn(app, viewerUser);
});

/** A finished run in the user's workspace whose stored results give balanceDb mean 0.12 dB, sd 0.2 dB. */
async function storedRun(u: BuiltUser): Promise<string> {
  const db = app.deps.db;
  const design = await db
    .insertInto('designs')
    .values({ workspace_id: u.workspaceId, name: 'Stored run stage', created_by: u.id, latest_rev: 1 })
    .returning('id')
    .executeTakeFirstOrThrow();
  const run = await db
    .insertInto('runs')
    .values({
      workspace_id: u.workspaceId,
      design_id: design.id,
      revision: 1,
      created_by: u.id,
      samples: 1000,
      seed: 's',
      plan: 'random',
      chunk_size: 1000,
      analyses: '{}',
      design: '{}',
      engine_version: 'test',
      chunk_total: 1,
      status: 'done',
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await db
    .insertInto('run_results')
    .values({
      run_id: run.id,
      results: JSON.stringify({
        metrics: { balanceDb: { mean: 0.12, sd: 0.2 }, gainDiff: { mean: 1, sd: null } },
      }),
      valid_count: 1000,
      joint_yield: 1,
    })
    .execute();
  return run.id;
}
afterAll(() => app?.close());

const base = {
  process: { mean: 100, sd: 1 },
  measurementSd: 0.3,
  spec: { low: 97.5, high: 102.5 },
};

describe('POST /api/test-limits', () => {
  it('gives the engine rates and a guard band meeting the PPM target', async () => {
    const res = await viewer.post('/api/test-limits', {
      ...base,
      test: { low: 97.7, high: 102.3 },
      targetFalseAcceptPpm: 50,
    });
    expect(res.status).toBe(200);
    const want = testLimitRates({ ...base, test: { low: 97.7, high: 102.3 } });
    expect(res.body.rates.falseAccept).toBeCloseTo(want.falseAccept, 15);
    expect(res.body.suggestion.reached).toBe(true);
    expect(res.body.suggestion.rates.falseAccept).toBeLessThanOrEqual(50e-6);
    expect(res.body.suggestion.test.low).toBeGreaterThan(97.5);
  });

  it('uses the spec limits as test limits when none are given', async () => {
    const res = await viewer.post('/api/test-limits', base);
    expect(res.body.test).toEqual(base.spec);
    expect(res.body.suggestion).toBeNull();
  });

  it('names the field of bad input', async () => {
    const cases: [unknown, string][] = [
      [{ ...base, measurementSd: -1 }, 'measurementSd'],
      [{ ...base, spec: {} }, 'spec.low'],
      [{ ...base, spec: { low: 3, high: 1 } }, 'spec.high'],
      [{ ...base, test: { low: 'x' } }, 'test.low'],
      [{ ...base, targetFalseAcceptPpm: 0 }, 'targetFalseAcceptPpm'],
      [{ ...base, process: { mean: 1, sd: 0 } }, 'process'],
    ];
    for (const [body, field] of cases) {
      const res = await viewer.post('/api/test-limits', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.field, JSON.stringify(body)).toMatch(new RegExp(`^${field.replace('.', '\\.')}`));
    }
  });

  it("takes the process from a stored run's metric, only in the run's own workspace", async () => {
    const runId = await storedRun(viewerUser);
    const body = { measurementSd: 0.05, spec: { low: -0.5, high: 0.5 } };
    const res = await viewer.post('/api/test-limits', { ...body, process: { runId, metric: 'balanceDb' } });
    expect(res.status).toBe(200);
    expect(res.body.process).toEqual({ mean: 0.12, sd: 0.2, runId, metric: 'balanceDb' });
    const want = testLimitRates({ ...body, process: { mean: 0.12, sd: 0.2 }, test: body.spec });
    expect(res.body.rates.falseReject).toBeCloseTo(want.falseReject, 15);
    const noSpread = await viewer.post('/api/test-limits', {
      ...body,
      process: { runId, metric: 'gainDiff' },
    });
    expect(noSpread.status).toBe(400);
    expect(noSpread.body.error.field).toBe('process.metric');
    const other = await signIn(app, await buildUser(app.deps.db, { role: 'admin' }));
    const guess = await other.post('/api/test-limits', { ...body, process: { runId, metric: 'balanceDb' } });
    expect(guess.status).toBe(404);
  });

  it('answers 404 naming process.runId for a run of no workspace of the user', async () => {
    const res = await viewer.post('/api/test-limits', {
      ...base,
      process: { runId: randomUUID(), metric: 'balanceDb' },
    });
    expect(res.status).toBe(404);
    expect(res.body.error.field).toBe('process.runId');
  });
});
