import { describe, expect, it, vi } from 'vitest';
import type { RunView } from './runSchemas.js';
import { RunViewCache } from './runViewCache.js';

const view = (status: RunView['status']) => ({ id: 'r1', status }) as RunView;

describe('RunViewCache', () => {
  it('serves a view for ttl, then reloads; never across workspaces; forget reloads at once', async () => {
    vi.useFakeTimers();
    try {
      const cache = new RunViewCache(250);
      const load = vi.fn(async () => ({ view: view('running'), workspaceId: 'w1' }));
      expect(await cache.get('w1', 'r1', load)).toEqual(view('running'));
      expect(await cache.get('w1', 'r1', load)).toEqual(view('running'));
      expect(load).toHaveBeenCalledTimes(1);
      expect(await cache.get('w2', 'r1', load)).toBeUndefined(); // another workspace: not found
      vi.advanceTimersByTime(250);
      load.mockResolvedValueOnce({ view: view('done'), workspaceId: 'w1' });
      expect(await cache.get('w1', 'r1', load)).toEqual(view('done'));
      expect(load).toHaveBeenCalledTimes(2);
      cache.forget('r1');
      await cache.get('w1', 'r1', load);
      expect(load).toHaveBeenCalledTimes(3);
      expect(await cache.get('w1', 'missing', async () => undefined)).toBeUndefined();
    } finally {
      vi.useRealTimers();
    }
  });
});

describe('RunViewCache under many pollers', () => {
  it('shares one load among concurrent misses, each caller still checked by workspace', async () => {
    const cache = new RunViewCache(250);
    const load = vi.fn(async () => ({ view: view('running'), workspaceId: 'w1' }));
    const answers = await Promise.all([
      ...Array.from({ length: 20 }, () => cache.get('w1', 'r1', load)),
      cache.get('w2', 'r1', load),
    ]);
    expect(load).toHaveBeenCalledTimes(1);
    expect(answers.slice(0, 20).every((v) => v?.status === 'running')).toBe(true);
    expect(answers[20]).toBeUndefined();
  });

  it('does not store a load that was in flight when the run was forgotten', async () => {
    const cache = new RunViewCache(250);
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const stale = cache.get('w1', 'r1', async () => {
      await gate; // read before the cancel committed
      return { view: view('running'), workspaceId: 'w1' };
    });
    cache.forget('r1');
    const fresh = vi.fn(async () => ({ view: view('cancelled'), workspaceId: 'w1' }));
    expect(await cache.get('w1', 'r1', fresh)).toEqual(view('cancelled'));
    release();
    await stale;
    expect(await cache.get('w1', 'r1', fresh)).toEqual(view('cancelled'));
    expect(fresh).toHaveBeenCalledTimes(1);
  });
});

describe('RunViewCache refresh ahead', () => {
  it('reloads in the background from half the TTL on, answering from the cache meanwhile', async () => {
    vi.useFakeTimers();
    try {
      const cache = new RunViewCache(250);
      const load = vi.fn(async () => ({ view: view('running'), workspaceId: 'w1' }));
      await cache.get('w1', 'r1', load);
      vi.advanceTimersByTime(124);
      await cache.get('w1', 'r1', load);
      expect(load).toHaveBeenCalledTimes(1);
      vi.advanceTimersByTime(1);
      load.mockResolvedValueOnce({ view: view('done'), workspaceId: 'w1' });
      expect(await cache.get('w1', 'r1', load)).toEqual(view('running')); // still fresh
      expect(load).toHaveBeenCalledTimes(2);
      await Promise.resolve();
      expect(await cache.get('w1', 'r1', load)).toEqual(view('done'));
    } finally {
      vi.useRealTimers();
    }
  });
});
