import { describe, expect, it } from 'vitest';
import type { SessionUser } from './requireRole.js';
import { SessionCache } from './sessionCache.js';

const user = (id: string, role: SessionUser['role'] = 'engineer'): SessionUser => ({
  id,
  email: `${id}@fixture.example`,
  name: id,
  workspaceId: 'ws-1',
  workspaceName: 'Fixture',
  role,
});

/** A cache on a hand-driven clock, and a loader that counts its calls and answers `answer()`. */
function setup(ttlMs = 1_000, maxEntries = 100) {
  let now = 1_000_000;
  const cache = new SessionCache(ttlMs, maxEntries, () => now);
  let calls = 0;
  let answer: SessionUser | null = user('u1');
  const load =
    (userId = 'u1', expiresAt = Infinity) =>
    async () => {
      calls++;
      return { userId, user: answer, expiresAt };
    };
  return {
    cache,
    load,
    calls: () => calls,
    setAnswer: (u: SessionUser | null) => (answer = u),
    tick: (ms: number) => (now += ms),
  };
}

describe('SessionCache', () => {
  it('answers repeats of a token from the cache until the TTL passes', async () => {
    const t = setup();
    expect(await t.cache.get('tok', t.load())).toEqual(user('u1'));
    t.tick(499);
    expect(await t.cache.get('tok', t.load())).toEqual(user('u1'));
    expect(t.calls()).toBe(1);
    t.tick(501); // a full TTL since the load, with no request in between: must reload
    await t.cache.get('tok', t.load());
    expect(t.calls()).toBe(2);
  });

  it('reloads in the background from half the TTL on, answering from the cache meanwhile', async () => {
    const t = setup();
    await t.cache.get('tok', t.load());
    t.setAnswer(user('u1', 'viewer'));
    t.tick(500);
    expect((await t.cache.get('tok', t.load()))!.role).toBe('engineer'); // still fresh: cached answer
    expect(t.calls()).toBe(2); // ...and a reload started
    await Promise.resolve();
    expect((await t.cache.get('tok', t.load()))!.role).toBe('viewer');
    t.tick(999); // within the reload's TTL: answered from the cache, and reloaded again
    await t.cache.get('tok', t.load());
    expect(t.calls()).toBe(3);
  });

  it('untrusted (its broadcast channel down): every request loads, nothing is kept', async () => {
    const t = setup();
    await t.cache.get('tok', t.load());
    t.cache.trusted = false;
    t.setAnswer(null); // e.g. signed out by another process while the channel was down
    expect(await t.cache.get('tok', t.load())).toBeNull();
    expect(await t.cache.get('tok', t.load())).toBeNull();
    expect(t.calls()).toBe(3);
  });

  it('forgetUser and forgetAll broadcast the change to the other processes', async () => {
    const t = setup();
    const sent: string[] = [];
    t.cache.broadcast = async (payload) => void sent.push(payload);
    await t.cache.forgetUser('u1');
    await t.cache.forgetAll();
    expect(sent).toEqual(['u1', '*']);
  });

  it('never serves an entry past the token expiry', async () => {
    const t = setup();
    await t.cache.get('tok', t.load('u1', 1_000_000 + 10));
    t.tick(10);
    await t.cache.get('tok', t.load('u1', 1_000_000 + 10));
    expect(t.calls()).toBe(2);
  });

  it('forgetUser makes a role change or removal visible on the next request', async () => {
    const t = setup();
    await t.cache.get('tok', t.load());
    t.setAnswer(user('u1', 'viewer'));
    expect((await t.cache.get('tok', t.load()))!.role).toBe('engineer'); // cached
    t.cache.forgetUser('u1');
    expect((await t.cache.get('tok', t.load()))!.role).toBe('viewer');
    t.setAnswer(null); // membership removed
    t.cache.forgetUser('u1');
    expect(await t.cache.get('tok', t.load())).toBeNull();
  });

  it('forgetUser keeps other users; forgetAll drops everyone', async () => {
    const t = setup();
    await t.cache.get('a', t.load('u1'));
    await t.cache.get('b', t.load('u2'));
    t.cache.forgetUser('u1');
    expect(t.cache.size).toBe(1);
    await t.cache.get('b', t.load('u2'));
    expect(t.calls()).toBe(2);
    t.cache.forgetAll();
    expect(t.cache.size).toBe(0);
  });

  it('does not store a lookup that was in flight when the user was forgotten', async () => {
    const t = setup();
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const stale = t.cache.get('tok', async () => {
      await gate; // read before the change committed, answered after it
      return { userId: 'u1', user: user('u1', 'admin'), expiresAt: Infinity };
    });
    t.cache.forgetUser('u1');
    release();
    expect((await stale)!.role).toBe('admin');
    expect((await t.cache.get('tok', t.load()))!.role).toBe('engineer');
    expect(t.calls()).toBe(1);
  });

  it('shares one lookup among concurrent misses on a token', async () => {
    const t = setup();
    const all = await Promise.all(Array.from({ length: 20 }, () => t.cache.get('tok', t.load())));
    expect(all.every((u) => u?.id === 'u1')).toBe(true);
    expect(t.calls()).toBe(1);
  });

  it('does not cache tokens that fail verification', async () => {
    const t = setup();
    let calls = 0;
    const bad = async () => {
      calls++;
      return undefined;
    };
    expect(await t.cache.get('forged', bad)).toBeNull();
    expect(await t.cache.get('forged', bad)).toBeNull();
    expect(calls).toBe(2);
    expect(t.cache.size).toBe(0);
  });

  it('stays within its size bound, dropping the oldest entry', async () => {
    const t = setup(1_000, 3);
    for (const tok of ['a', 'b', 'c', 'd']) await t.cache.get(tok, t.load());
    expect(t.cache.size).toBe(3);
    await t.cache.get('a', t.load());
    expect(t.calls()).toBe(5); // 'a' was evicted
    await t.cache.get('d', t.load());
    expect(t.calls()).toBe(5);
  });
});
