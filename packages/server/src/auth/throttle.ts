import type { Database } from '@sigmatail/db';
import { sql, type Kysely } from 'kysely';
import { HttpError } from '../http/httpError.js';

/** One rate limit: at most `limit` hits of `key` per `windowMs`. */
export interface ThrottleRule {
  key: string;
  limit: number;
  windowMs: number;
}

/** 429 with a message (and Retry-After in seconds, set by the error handler's caller). */
export class TooManyRequests extends HttpError {
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super(429, message);
  }
}

/**
 * Rate-limit counters kept in PostgreSQL (table auth_throttle), so the limits hold across every
 * server process on the database. Fixed windows: the first hit after a window ends starts a new one.
 */
export class Throttle {
  /** @param scope prefix of every key (config.rateLimitScope) */
  constructor(
    private readonly db: Kysely<Database>,
    private readonly scope: string,
  ) {}

  private key(k: string): string {
    return `${this.scope}:${k}`;
  }

  /** Throws TooManyRequests when any rule's key already has `limit` hits in its current window. */
  async check(rules: readonly ThrottleRule[], message: string): Promise<void> {
    if (rules.length === 0) return;
    const rows = await this.db
      .selectFrom('auth_throttle')
      .select(['key', 'hits', sql<number>`extract(epoch from window_start) * 1000`.as('startMs')])
      .where(
        'key',
        'in',
        rules.map((r) => this.key(r.key)),
      )
      .execute();
    const now = Date.now();
    for (const rule of rules) {
      const row = rows.find((r) => r.key === this.key(rule.key));
      if (!row) continue;
      const endsAt = Number(row.startMs) + rule.windowMs;
      if (endsAt > now && row.hits >= rule.limit) {
        throw new TooManyRequests(message, Math.max(1, Math.ceil((endsAt - now) / 1000)));
      }
    }
  }

  /** Counts one hit against every rule's key (atomically: concurrent processes never lose a hit). */
  async hit(rules: readonly ThrottleRule[]): Promise<void> {
    for (const rule of rules) {
      const windowSeconds = rule.windowMs / 1000;
      await sql`
        insert into auth_throttle (key, hits, window_start) values (${this.key(rule.key)}, 1, now())
        on conflict (key) do update set
          hits = case when auth_throttle.window_start <= now() - make_interval(secs => ${windowSeconds})
                      then 1 else auth_throttle.hits + 1 end,
          window_start = case when auth_throttle.window_start <= now() - make_interval(secs => ${windowSeconds})
                              then now() else auth_throttle.window_start end`.execute(this.db);
    }
    // Rows whose window ended a day ago say nothing any more.
    await this.db
      .deleteFrom('auth_throttle')
      .where('window_start', '<', sql<Date>`now() - interval '1 day'`)
      .execute();
  }

  /** Forgets keys (e.g. a successful sign-in clears that source's failures for the account). */
  async clear(keys: readonly string[]): Promise<void> {
    if (keys.length) {
      await this.db
        .deleteFrom('auth_throttle')
        .where(
          'key',
          'in',
          keys.map((k) => this.key(k)),
        )
        .execute();
    }
  }
}
