import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTeam } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app?.close());

describe('workspace settings', () => {
  it('any member reads them; an admin changes name and settings, one key at a time', async () => {
    const team = await buildTeam(app.deps.db);
    const viewer = await signIn(app, team.viewer);
    const admin = await signIn(app, team.admin);
    const got = await viewer.get('/api/workspace');
    expect(got.status).toBe(200);
    expect(got.body.workspace.settings).toEqual({
      defaultSamples: 100000,
      defaultPlan: 'lhs',
      defaultYieldTarget: 0.99,
    });

    const patched = await admin.patch('/api/workspace', {
      name: 'Renamed works',
      settings: { defaultSamples: 250000 },
    });
    expect(patched.status).toBe(200);
    expect(patched.body.workspace).toMatchObject({
      name: 'Renamed works',
      settings: { defaultSamples: 250000, defaultPlan: 'lhs', defaultYieldTarget: 0.99 },
    });
    const plan = await admin.patch('/api/workspace', {
      settings: { defaultPlan: 'sobol', defaultYieldTarget: 0.999 },
    });
    expect(plan.body.workspace.settings).toEqual({
      defaultSamples: 250000,
      defaultPlan: 'sobol',
      defaultYieldTarget: 0.999,
    });
    expect((await viewer.get('/api/auth/me')).body.user.workspace.name).toBe('Renamed works');
    const audit = await admin.get('/api/audit?action=workspace.update');
    expect(audit.body.events).toHaveLength(2);
  });

  it('refuses bad settings naming the field', async () => {
    const team = await buildTeam(app.deps.db);
    const admin = await signIn(app, team.admin);
    const cases: [unknown, string][] = [
      [{ settings: { defaultSamples: 0 } }, 'settings.defaultSamples'],
      [{ settings: { defaultSamples: 1.5 } }, 'settings.defaultSamples'],
      [{ settings: { defaultSamples: 1e9 } }, 'settings.defaultSamples'],
      [{ settings: { defaultPlan: 'grid' } }, 'settings.defaultPlan'],
      [{ settings: { defaultYieldTarget: 99 } }, 'settings.defaultYieldTarget'],
      [{ name: '' }, 'name'],
    ];
    for (const [body, field] of cases) {
      const res = await admin.patch('/api/workspace', body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.field).toBe(field);
    }
    const unknownKey = await admin.patch('/api/workspace', { settings: { colour: 'red' } });
    expect(unknownKey.status).toBe(400);
  });
});
