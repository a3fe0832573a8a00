import { testLimitRates } from '@sigmatail/engine';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';

let app: TestApp;
let viewer: TestClient;
beforeAll(async () => {
  app = await startTestApp();
  viewer = await signIn(app, await buildUser(app.deps.db, { role: 'viewer' }));
});
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

  it('answers 404 naming process.runId for a run of no workspace of the user', async () => {
    const res = await viewer.post('/api/test-limits', {
      ...base,
      process: { runId: randomUUID(), metric: 'balanceDb' },
    });
    expect(res.status).toBe(404);
    expect(res.body.error.field).toBe('process.runId');
  });
});
