import { randomUUID } from 'node:crypto';
import { ROLES, type Role } from '@sigmatail/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from './app.js';
import { listApiRoutes } from './http/listApiRoutes.js';
import { exampleDesign } from './runs/testing/exampleDesign.js';
import { buildWorkspaceData, type WorkspaceData } from './testing/buildWorkspaceData.js';
import { startTestApp, type TestApp } from './testing/startTestApp.js';
import type { TestClient } from './testing/testClient.js';
import { workspaceSnapshot } from './testing/workspaceSnapshot.js';

// A user of workspace A guesses (knows) the ids of workspace B's design, run, member, invite and
// mail and tries every route with them, as every role: nothing of B is read or changed.
let app: TestApp;
let a: WorkspaceData;
let b: WorkspaceData;
beforeAll(async () => {
  app = await startTestApp();
  a = await buildWorkspaceData(app);
  b = await buildWorkspaceData(app);
}, 60_000);
afterAll(() => app?.close());

/** B's id for each kind of path parameter, by route prefix; routes not listed here are skipped. */
function otherWorkspaceUrl(pattern: string): string | null {
  const id: [RegExp, string][] = [
    [/^\/api\/designs\/:id/, b.designId],
    [/^\/api\/runs\/:id/, b.runId],
    [/^\/api\/users\/:id/, b.team.engineer.id],
    [/^\/api\/invites\/:id/, b.inviteId],
    [/^\/api\/dev\/inbox\/:id/, b.mailId],
  ];
  const hit = id.find(([re]) => re.test(pattern));
  if (!hit) return null;
  return pattern.replace(':id', hit[1]).replace(':rev', '1');
}

/** A body that would be accepted for A's own object, so only the workspace check can refuse it. */
function plausibleBody(route: string): unknown {
  if (/revisions$/.test(route)) return { document: exampleDesign(), message: 'hijack' };
  if (/archive$/.test(route)) return { archived: true };
  if (route.startsWith('PATCH /api/users/')) return { role: 'viewer' };
  return {};
}

describe('workspace isolation', () => {
  it('every route with an id refuses another workspace’s ids (404 or 403), for every role, and changes nothing', async () => {
    const routes = listApiRoutes(createApp(app.deps));
    const before = await workspaceSnapshot(app.deps.db, [b.workspaceId]);
    const leaks: string[] = [];
    let tried = 0;
    for (const route of routes) {
      const [method, pattern] = route.split(' ') as [string, string];
      const url = otherWorkspaceUrl(pattern);
      if (!url) continue;
      for (const role of ROLES) {
        const client = a.clients[role];
        const res = await client.request(
          method,
          url,
          method === 'GET' || method === 'DELETE' ? undefined : plausibleBody(route),
        );
        tried++;
        if (res.status !== 404 && res.status !== 403) leaks.push(`${route} as ${role}: ${res.status}`);
      }
    }
    expect(leaks).toEqual([]);
    expect(tried).toBeGreaterThanOrEqual(14 * ROLES.length); // 14 id routes today: designs, runs, users, invites, mail
    expect(await workspaceSnapshot(app.deps.db, [b.workspaceId])).toBe(before);
  });

  it('id-less routes never name another workspace’s objects or act on them', async () => {
    const before = await workspaceSnapshot(app.deps.db, [b.workspaceId]);
    const admin = a.clients.admin;
    const bIds = [b.designId, b.runId, b.team.engineer.id, b.inviteId, b.mailId, b.inviteEmail];
    for (const p of [
      '/api/designs?archived=include',
      `/api/designs?q=${encodeURIComponent('Guitar')}`,
      '/api/runs',
      `/api/runs?designId=${b.designId}`,
      '/api/users',
      '/api/audit?limit=500',
      '/api/dev/inbox?limit=500',
      `/api/dev/inbox?to=${encodeURIComponent(b.inviteEmail)}`,
      '/api/workspace',
      '/api/auth/workspaces',
    ]) {
      for (const role of ROLES) {
        const res = await a.clients[role].get(p);
        const text = JSON.stringify(res.body);
        for (const id of bIds) expect(text, `${p} as ${role} shows ${id}`).not.toContain(id);
      }
    }
    // Acting on B through routes that take ids in the body.
    const launch = await a.clients.engineer.post('/api/runs', {
      designId: b.designId,
      samples: 1000,
      plan: 'random',
    });
    expect(launch.status).toBe(404);
    const sw = await admin.post('/api/auth/workspace', { workspaceId: b.workspaceId });
    expect(sw.status).toBe(404);
    const invite = await admin.post('/api/invites', { email: b.team.viewer.email, role: 'admin' });
    expect(invite.status).toBe(201); // inviting a person is allowed: they join A, B is untouched
    expect(await workspaceSnapshot(app.deps.db, [b.workspaceId])).toBe(before);
  });

  it('B’s own people still see their things (the fixture is real)', async () => {
    const roles: Role[] = ['admin', 'viewer'];
    for (const role of roles) {
      expect((await b.clients[role].get(`/api/designs/${b.designId}`)).status).toBe(200);
      expect((await b.clients[role].get(`/api/runs/${b.runId}/results`)).status).toBe(200);
    }
    expect((await b.clients.admin.get(`/api/dev/inbox/${b.mailId}`)).status).toBe(200);
    expect((await b.clients.admin.get(`/api/dev/inbox/${randomUUID()}`)).status).toBe(404);
    const client: TestClient = b.clients.admin;
    expect((await client.get('/api/users')).body.invites.map((i: { id: string }) => i.id)).toContain(
      b.inviteId,
    );
  });
});
