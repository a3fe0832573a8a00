import type { RunView } from './runSchemas.js';

type Loaded = { view: RunView; workspaceId: string } | undefined;

/**
 * A short-lived cache of run views for status polling (many clients polling one run's progress).
 * A view is at most `ttlMs` old; the caller still checks the workspace of the signed-in user, and
 * changes made through this process (cancel) drop the entry at once. Concurrent misses on one run
 * share one load, so an expiring entry under many pollers costs one query, not one per poller,
 * and a hit in the second half of the TTL reloads in the background, so polls rarely wait on it.
 */
export class RunViewCache {
  private readonly entries = new Map<string, { view: RunView; workspaceId: string; at: number }>();
  private readonly loading = new Map<string, Promise<Loaded>>();
  private generation = 0;

  constructor(
    private readonly ttlMs = 250,
    private readonly maxEntries = 1_000,
  ) {}

  async get(workspaceId: string, runId: string, load: () => Promise<Loaded>): Promise<RunView | undefined> {
    const now = Date.now();
    const hit = this.entries.get(runId);
    if (hit && now - hit.at < this.ttlMs) {
      // Refresh ahead in the background, so steady polling never waits for the entry to expire.
      if (now - hit.at >= this.ttlMs / 2 && !this.loading.has(runId)) {
        this.load(runId, load, now).catch(() => undefined);
      }
      return hit.workspaceId === workspaceId ? hit.view : undefined;
    }
    const loaded = await this.load(runId, load, now);
    return loaded && loaded.workspaceId === workspaceId ? loaded.view : undefined;
  }

  /** One shared load per run; its answer is stored unless forget() was called meanwhile. */
  private load(runId: string, load: () => Promise<Loaded>, now: number): Promise<Loaded> {
    const running = this.loading.get(runId);
    if (running) return running;
    const generation = this.generation;
    const pending: Promise<Loaded> = load()
      .then((loaded) => {
        // A load that was running when forget() was called may hold the old state: not stored.
        if (loaded && generation === this.generation) {
          if (this.entries.size >= this.maxEntries) this.entries.clear();
          this.entries.set(runId, { ...loaded, at: now });
        }
        return loaded;
      })
      .finally(() => {
        if (this.loading.get(runId) === pending) this.loading.delete(runId);
      });
    this.loading.set(runId, pending);
    return pending;
  }

  forget(runId: string): void {
    this.generation++;
    this.entries.delete(runId);
    this.loading.delete(runId);
  }
}
