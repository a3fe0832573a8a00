import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTeam } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app?.close());

describe('dev inbox and audit', () => {
  it('shows mail caught by the SMTP fake, newest first, and 404 for unknown ids', async () => {
    const team = await buildTeam(app.deps.db);
    const admin = await signIn(app, team.admin);
    const email = `inbox-${team.admin.id}@fixture.example`;
    await admin.post('/api/invites', { email, role: 'viewer' });
    const list = await admin.get(`/api/dev/inbox?to=${encodeURIComponent(email)}`);
    expect(list.status).toBe(200);
    expect(list.body.messages).toHaveLength(1);
    const msg = await admin.get(`/api/dev/inbox/${list.body.messages[0].id}`);
    expect(msg.body.message).toMatchObject({ to: email, subject: expect.stringMatching(/invited you/) });
    expect(msg.body.message.text).toContain('/invite/');
    expect((await admin.get('/api/dev/inbox/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await admin.get('/api/dev/inbox/nope')).status).toBe(404);
    expect((await admin.get('/api/dev/inbox?limit=0')).body.error.field).toBe('limit');
  });

  it('lists only the own workspace’s events and validates the filters', async () => {
    const a = await buildTeam(app.deps.db);
    const b = await buildTeam(app.deps.db);
    const adminA = await signIn(app, a.admin);
    await signIn(app, b.engineer);
    const events = (await adminA.get('/api/audit')).body.events as { user: { id: string } | null }[];
    expect(events.length).toBeGreaterThan(0);
    expect(events.every((e) => e.user?.id !== b.engineer.id)).toBe(true);
    const bad = await adminA.get('/api/audit?before=yesterday');
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('before');
  });
});
