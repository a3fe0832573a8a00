import type { Database } from '@sigmatail/db';
import { listenForNotifications } from '@sigmatail/db';
import { sql, type Kysely } from 'kysely';
import type { SessionUser } from './requireRole.js';

/** What resolving a token gives: the signed-in user (null = valid signature, but no access) and when the token expires (ms). */
export interface ResolvedSession {
  user: SessionUser | null;
  expiresAt: number;
}

interface Entry {
  user: SessionUser | null;
  userId: string;
  /** Epoch ms from which a hit also starts a background reload (half the TTL). */
  refreshAt: number;
  /** Epoch ms after which the entry must not be used (the TTL or the token's own expiry). */
  until: number;
}

/**
 * A short-lived cache of resolved session tokens (signature checked, user and membership read), so
 * many requests on one session cost one token check and one query per `ttlMs`.
 *
 * A removed member, a changed role, a sign-out or a bumped session_epoch must still take effect at
 * once, in every server process: every route that changes them awaits forgetUser / forgetAll after
 * its transaction commits, which clears this cache and broadcasts the change (PostgreSQL NOTIFY,
 * see sessionCacheFor) so the caches of other processes on the same database drop it too. While
 * that broadcast channel is down the cache is not trusted: every request reads the database.
 * A load that started before a forget is not stored (generation check), so a lookup racing a
 * change cannot put the old answer back. Concurrent misses on one token share one load, and a hit
 * in the second half of the TTL reloads in the background, so steady traffic never waits on it.
 */
export class SessionCache {
  private readonly entries = new Map<string, Entry>();
  private readonly loading = new Map<string, Promise<SessionUser | null>>();
  private generation = 0;
  /** False while changes made by other processes might be missed: then nothing is served from the cache. */
  trusted = true;
  /** Tells the other processes (and this one) that a user's sessions changed; '*' = everyone's. */
  broadcast: (userIdOrAll: string) => Promise<void> = async () => undefined;

  constructor(
    private readonly ttlMs = 1_000,
    private readonly maxEntries = 10_000,
    private readonly now: () => number = () => Date.now(),
  ) {}

  /**
   * The user of `token`, from the cache or else from `load` (which returns undefined for a token
   * that does not verify; such tokens are not cached). `userId` names whom the entry belongs to
   * for forgetUser; it is read from `load`'s answer.
   */
  async get(
    token: string,
    load: () => Promise<(ResolvedSession & { userId: string }) | undefined>,
  ): Promise<SessionUser | null> {
    if (!this.trusted) {
      const resolved = await load();
      return resolved ? resolved.user : null;
    }
    const now = this.now();
    const hit = this.entries.get(token);
    if (hit && now < hit.until) {
      // Refresh ahead in the background, so a busy session never waits for its entry to expire.
      if (now >= hit.refreshAt && !this.loading.has(token)) {
        this.load(token, load).catch(() => undefined);
      }
      return hit.user;
    }
    if (hit) this.entries.delete(token);
    return this.load(token, load);
  }

  /** One shared lookup per token; its answer is stored unless a forget happened meanwhile. */
  private load(
    token: string,
    load: () => Promise<(ResolvedSession & { userId: string }) | undefined>,
  ): Promise<SessionUser | null> {
    const pending = this.loading.get(token);
    if (pending) return pending;
    const generation = this.generation;
    const started = this.now();
    const promise = load()
      .then((resolved) => {
        if (!resolved) return null;
        if (generation === this.generation) {
          this.store(token, {
            user: resolved.user,
            userId: resolved.userId,
            refreshAt: started + this.ttlMs / 2,
            until: Math.min(started + this.ttlMs, resolved.expiresAt),
          });
        }
        return resolved.user;
      })
      .finally(() => {
        if (this.loading.get(token) === promise) this.loading.delete(token);
      });
    this.loading.set(token, promise);
    return promise;
  }

  /**
   * Drops every entry of one user (membership, role, session, epoch or password changed), here and
   * in every other process; resolves once the broadcast is sent.
   */
  async forgetUser(userId: string): Promise<void> {
    this.forgetLocal(userId);
    await this.broadcast(userId);
  }

  /** Drops everything, here and in every other process (e.g. a workspace renamed: its name is part of every member's session). */
  async forgetAll(): Promise<void> {
    this.forgetAllLocal();
    await this.broadcast('*');
  }

  /** Drops one user's entries in this process only (what a received broadcast does). */
  forgetLocal(userId: string): void {
    this.generation++;
    this.loading.clear();
    for (const [token, entry] of this.entries) if (entry.userId === userId) this.entries.delete(token);
  }

  /** Drops every entry in this process only. */
  forgetAllLocal(): void {
    this.generation++;
    this.loading.clear();
    this.entries.clear();
  }

  get size(): number {
    return this.entries.size;
  }

  private store(token: string, entry: Entry): void {
    this.entries.delete(token);
    // Maps iterate in insertion order: the first key is the oldest entry.
    while (this.entries.size >= this.maxEntries) {
      const oldest = this.entries.keys().next().value;
      if (oldest === undefined) break;
      this.entries.delete(oldest);
    }
    this.entries.set(token, entry);
  }
}

const caches = new WeakMap<Kysely<Database>, SessionCache>();

/** The NOTIFY channel on which session changes are broadcast; the payload is a user id or '*'. */
export const SESSION_CHANNEL = 'sigmatail_sessions';

/**
 * The session cache of one database handle: loadSession reads through it and the routes that
 * change memberships, roles, sessions, epochs or passwords (all given the same AppDeps.db) forget
 * through it. It listens on SESSION_CHANNEL, so a change made by any process clears it, and it is
 * only trusted while that LISTEN connection is up.
 */
export function sessionCacheFor(db: Kysely<Database>, ttlMs?: number): SessionCache {
  let cache = caches.get(db);
  if (!cache) {
    // The first caller (loadSession, when the app is built) sets the TTL.
    const c = new SessionCache(ttlMs);
    cache = c;
    caches.set(db, c);
    c.trusted = false;
    c.broadcast = async (payload) => {
      await sql`select pg_notify(${SESSION_CHANNEL}, ${payload})`.execute(db);
    };
    try {
      listenForNotifications(db, {
        channel: SESSION_CHANNEL,
        onMessage: (payload) => (payload === '*' ? c.forgetAllLocal() : c.forgetLocal(payload)),
        onState: (connected) => {
          c.forgetAllLocal();
          c.trusted = connected;
        },
      });
    } catch {
      // A handle not made by createDb: no broadcast channel, so the cache stays untrusted (unused).
    }
  }
  return cache;
}
