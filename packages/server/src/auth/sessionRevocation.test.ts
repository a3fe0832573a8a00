import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import { sessionCacheFor } from './sessionCache.js';

// Two app instances on one database, each with its own pool, session cache and LISTEN connection:
// what two server processes behind one address would be.
let a: TestApp;
let b: TestApp;
beforeAll(async () => {
  const secret = randomBytes(32).toString('hex');
  // A long cache TTL: only the broadcast can clear a cached session within a test.
  a = await startTestApp({ secret, sessionCacheTtlMs: 120_000 });
  b = await startTestApp({ secret, sessionCacheTtlMs: 120_000 });
  // Until its LISTEN connection is up a cache is bypassed; wait so the tests exercise the cache.
  for (const app of [a, b]) {
    const cache = sessionCacheFor(app.deps.db);
    for (let i = 0; i < 200 && !cache.trusted; i++) await new Promise((r) => setTimeout(r, 10));
    expect(cache.trusted).toBe(true);
  }
});
afterAll(async () => {
  await a?.close();
  await b?.close();
});

/**
 * The status of GET /auth/me once the other process has had the broadcast: NOTIFY reaches it
 * asynchronously (typically within milliseconds), so poll briefly rather than race it.
 */
async function meStatusSettled(client: ReturnType<TestApp['client']>, want: number): Promise<number> {
  let status = 0;
  for (let i = 0; i < 100; i++) {
    status = (await client.get('/api/auth/me')).status;
    if (status === want) break;
    await new Promise((r) => setTimeout(r, 10));
  }
  return status;
}

/** The same browser session (cookie) sent to instance `app`. */
function sameSessionOn(app: TestApp, cookie: string | undefined) {
  const c = app.client();
  c.cookie = cookie;
  return c;
}

describe('sessions across server processes', () => {
  it('sign-out on one instance refuses the old cookie on the other at once, though it was cached there', async () => {
    const u = await buildUser(a.deps.db);
    const onA = await signIn(a, u);
    const cookie = onA.cookie;
    const onB = sameSessionOn(b, cookie);
    expect((await onB.get('/api/auth/me')).status).toBe(200);
    expect(sessionCacheFor(b.deps.db).size).toBeGreaterThan(0); // B answers from its cache now
    expect((await onA.post('/api/auth/logout')).status).toBe(204);
    expect(await meStatusSettled(onB, 401)).toBe(401);
    // The cleared cookie is not the point: the old token itself is dead on both.
    expect((await sameSessionOn(a, cookie).get('/api/auth/me')).status).toBe(401);
  });

  it('sign-out ends only that session; the same user signed in elsewhere stays in', async () => {
    const u = await buildUser(a.deps.db);
    const laptop = await signIn(a, u);
    const bench = await signIn(b, u);
    expect((await laptop.post('/api/auth/logout')).status).toBe(204);
    expect((await bench.get('/api/auth/me')).status).toBe(200);
    expect((await sameSessionOn(b, laptop.cookie).get('/api/auth/me')).status).toBe(401);
  });

  it('sign out everywhere on one instance ends every session on the other', async () => {
    const u = await buildUser(a.deps.db);
    const laptop = await signIn(b, u);
    const bench = await signIn(b, u);
    expect((await laptop.get('/api/auth/me')).status).toBe(200);
    const onA = sameSessionOn(a, bench.cookie);
    expect((await onA.post('/api/auth/logout', { everywhere: true })).status).toBe(204);
    expect(await meStatusSettled(laptop, 401)).toBe(401);
    expect(await meStatusSettled(bench, 401)).toBe(401);
  });

  it('a role change or removal made on one instance applies on the other at once', async () => {
    const admin = await buildUser(a.deps.db, { role: 'admin' });
    const u = await buildUser(a.deps.db, { role: 'engineer', workspaceId: admin.workspaceId });
    const adminOnA = await signIn(a, admin);
    const userOnB = await signIn(b, u);
    expect((await userOnB.get('/api/auth/me')).body.user.role).toBe('engineer');
    expect((await adminOnA.patch(`/api/users/${u.id}`, { role: 'viewer' })).status).toBe(200);
    let role = '';
    for (let i = 0; i < 100 && role !== 'viewer'; i++) {
      role = (await userOnB.get('/api/auth/me')).body.user.role;
      if (role !== 'viewer') await new Promise((r) => setTimeout(r, 10));
    }
    expect(role).toBe('viewer');
    expect((await adminOnA.delete(`/api/users/${u.id}`)).status).toBe(204);
    expect(await meStatusSettled(userOnB, 401)).toBe(401);
  });

  it('a session row that was revoked refuses its token even with the cache cold', async () => {
    const u = await buildUser(a.deps.db);
    const onA = await signIn(a, u);
    await a.deps.db
      .updateTable('sessions')
      .set({ revoked_at: new Date() })
      .where('user_id', '=', u.id)
      .execute();
    await sessionCacheFor(a.deps.db).forgetUser(u.id);
    expect((await onA.get('/api/auth/me')).status).toBe(401);
  });
});
