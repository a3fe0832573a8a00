import { randomUUID } from 'node:crypto';
import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { ROLES, type Role } from '@sigmatail/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from './app.js';
import type { RouteAccess, RouteAccessTable } from './http/routeAccess.js';
import { listApiRoutes } from './http/listApiRoutes.js';
import { buildTeam } from './testing/buildUser.js';
import { signIn } from './testing/signIn.js';
import { startTestApp, type TestApp } from './testing/startTestApp.js';
import type { TestClient } from './testing/testClient.js';

// The role × route matrix: every route the app registers × {anonymous, each role}.
// Expected access comes from every `*RouteAccess.ts` table under src/ (one per area, e.g.
// foundationRouteAccess.ts, runs/runsRouteAccess.ts); a route with no entry fails the test.

const SRC = path.dirname(fileURLToPath(import.meta.url));

async function loadAccessTables(): Promise<Record<string, RouteAccess>> {
  const files = (await readdir(SRC, { recursive: true })).filter((f) => /RouteAccess\.ts$/.test(f));
  const merged: Record<string, RouteAccess> = {};
  for (const f of files) {
    const mod = (await import(pathToFileURL(path.join(SRC, f)).href)) as Record<string, RouteAccessTable>;
    for (const table of Object.values(mod)) {
      for (const [route, access] of Object.entries(table)) {
        if (route in merged) throw new Error(`${route} is listed twice (again in ${f})`);
        merged[route] = access;
      }
    }
  }
  return merged;
}

type Who = 'anonymous' | Role;

function expected(access: RouteAccess, who: Who): 'allowed' | 401 | 403 {
  if (access === 'public') return 'allowed';
  if (who === 'anonymous') return 401;
  if (access === 'signedIn') return 'allowed';
  return access.includes(who) ? 'allowed' : 403;
}

let app: TestApp;
let access: Record<string, RouteAccess>;
let routes: string[];
const clients = {} as Record<Who, TestClient>;
let team: Awaited<ReturnType<typeof buildTeam>>;

/**
 * A client for `who` to call `route` with: a copy of the shared session, except for sign-out,
 * which revokes its session server-side and so gets a session of its own.
 */
async function clientFor(who: Who, route: string): Promise<TestClient> {
  if (route === 'POST /api/auth/logout' && who !== 'anonymous') return signIn(app, team[who]);
  return Object.assign(Object.create(Object.getPrototypeOf(clients[who])), clients[who]) as TestClient;
}

beforeAll(async () => {
  app = await startTestApp();
  access = await loadAccessTables();
  routes = listApiRoutes(createApp(app.deps));
  team = await buildTeam(app.deps.db);
  clients.anonymous = app.client();
  for (const role of ROLES) clients[role] = await signIn(app, team[role]);
});
afterAll(() => app?.close());

describe('role × route matrix', () => {
  it('finds the routes', () => {
    expect(routes.length).toBeGreaterThanOrEqual(24);
    expect(routes).toContain('GET /api/designs/:id');
  });

  it('has an expected-access entry for every registered route, and no stale entries', () => {
    const missing = routes.filter((r) => !(r in access));
    expect(missing, 'add these routes to a *RouteAccess.ts table').toEqual([]);
    const stale = Object.keys(access).filter((r) => !routes.includes(r));
    expect(stale, 'these table entries name no registered route').toEqual([]);
  });

  it('enforces the expected access for anonymous and every role', async () => {
    const failures: string[] = [];
    for (const route of routes) {
      const [method, pattern] = route.split(' ') as [string, string];
      // Any well-formed id: the row does not exist, so allowed callers get 400/404, never 401/403.
      const url = pattern.replace(/:[A-Za-z]+/g, () => randomUUID());
      for (const who of ['anonymous', ...ROLES] as Who[]) {
        const want = expected(access[route]!, who);
        const client = await clientFor(who, route);
        const res = await client.request(
          method,
          url,
          method === 'GET' || method === 'DELETE' ? undefined : {},
        );
        const ok = want === 'allowed' ? res.status !== 401 && res.status !== 403 : res.status === want;
        if (!ok || res.status >= 500) failures.push(`${route} as ${who}: got ${res.status}, want ${want}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it('answers malformed ids and junk bodies with 4xx, never 500 (as admin, who passes every role check)', async () => {
    const junk = {
      email: 5,
      password: [],
      role: 'owner',
      document: 'x',
      token: {},
      name: null,
      samples: 'many',
      designId: 'x',
    };
    const failures: string[] = [];
    for (const route of routes) {
      const [method, pattern] = route.split(' ') as [string, string];
      for (const bad of ['not-an-id', '12345', '%20']) {
        const url = pattern.replace(/:[A-Za-z]+/g, bad);
        if (url === pattern && bad !== 'not-an-id') continue;
        const client = await clientFor('admin', route);
        const res = await client.request(
          method,
          url,
          method === 'GET' || method === 'DELETE' ? undefined : junk,
        );
        if (res.status >= 500) failures.push(`${method} ${url}: ${res.status} ${JSON.stringify(res.body)}`);
      }
    }
    expect(failures).toEqual([]);
  });
});
