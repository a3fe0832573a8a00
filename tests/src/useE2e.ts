import { afterAll, beforeAll } from 'vitest';
import { startE2e, type E2eHarness } from './e2eHarness.js';

/**
 * One harness per test file: started before its tests (fresh database, server, worker, chromium)
 * and stopped after them. The object is filled in when the harness is up, so tests use it as is.
 */
export function useE2e(): E2eHarness {
  const h = {} as E2eHarness;
  beforeAll(async () => {
    Object.assign(h, await startE2e());
  }, 60_000);
  afterAll(async () => {
    await h.stop?.();
  });
  return h;
}
