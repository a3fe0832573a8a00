import type { RunView } from './runSchemas.js';

/**
 * A short-lived cache of run views for status polling (many clients polling one run's progress).
 * A view is at most `ttlMs` old; the caller still checks the workspace of the signed-in user, and
 * changes made through this process (cancel) drop the entry at once.
 */
export class RunViewCache {
  private readonly entries = new Map<string, { view: RunView; workspaceId: string; at: number }>();

  constructor(
    private readonly ttlMs = 250,
    private readonly maxEntries = 1_000,
  ) {}

  async get(
    workspaceId: string,
    runId: string,
    load: () => Promise<{ view: RunView; workspaceId: string } | undefined>,
  ): Promise<RunView | undefined> {
    const now = Date.now();
    const hit = this.entries.get(runId);
    if (hit && now - hit.at < this.ttlMs) return hit.workspaceId === workspaceId ? hit.view : undefined;
    const loaded = await load();
    if (!loaded) return undefined;
    if (this.entries.size >= this.maxEntries) this.entries.clear();
    this.entries.set(runId, { ...loaded, at: now });
    return loaded.workspaceId === workspaceId ? loaded.view : undefined;
  }

  forget(runId: string): void {
    this.entries.delete(runId);
  }
}
