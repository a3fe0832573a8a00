/** Settings the app needs at run time; main.ts reads them from the environment. */
export interface AppConfig {
  /** HS256 key for session tokens (at least 32 bytes of entropy). */
  secret: string;
  /** Public base URL used in mailed links, e.g. http://127.0.0.1:3000 (no trailing slash). */
  appUrl: string;
  /** Session lifetime in seconds. */
  sessionTtlSeconds: number;
  /**
   * How long a resolved session may be served from the in-process cache (ms). Changes clear it at
   * once in every process (NOTIFY), so this only bounds the staleness should a broadcast be lost.
   */
  sessionCacheTtlMs: number;
  /** Set the cookie's Secure flag (when served over https). */
  cookieSecure: boolean;
  /** Sender address of mail from the app. */
  mailFrom: string;
  /** Failed sign-ins allowed per (email, source IP) within loginWindowMs; reset mails: half as many. */
  loginLimit: number;
  /** Failed sign-ins (and reset requests) allowed per source IP across all emails within loginWindowMs. */
  loginSourceLimit: number;
  loginWindowMs: number;
  /**
   * Prefix of this app's rate-limit counters in auth_throttle: processes that share limits share
   * it (the default); tests give each app its own so parallel suites never count against each other.
   */
  rateLimitScope: string;
  /** Invites a workspace may send within inviteWindowMs. */
  inviteLimit: number;
  inviteWindowMs: number;
  /** Built web app to serve (with SPA fallback); null or missing folder = API only. */
  webDist: string | null;
  /**
   * Origins besides APP_URL's from which browsers may send state-changing requests
   * (e.g. 'https://sigmatail.example.org'); everything else cross-site gets 403.
   */
  allowedOrigins: string[];
  /**
   * Express 'trust proxy': false (default: req.ip is the socket address, X-Forwarded-* ignored),
   * true, a hop count or a list such as 'loopback'. Behind a TLS proxy it makes X-Forwarded-Proto
   * count, so the session cookie gets its Secure flag.
   */
  trustProxy: boolean | number | string;
}

// Session length, sign-in limits: common practice, no source (a working day; 10 failures per 15 min,
// per account and source and per source; 50 invites an hour).
export const DEFAULT_CONFIG: Omit<AppConfig, 'secret'> = {
  appUrl: 'http://127.0.0.1:3000',
  sessionTtlSeconds: 12 * 3600,
  sessionCacheTtlMs: 1_000,
  cookieSecure: false,
  mailFrom: 'Sigmatail <no-reply@sigmatail.example>',
  loginLimit: 10,
  loginSourceLimit: 10,
  loginWindowMs: 15 * 60 * 1000,
  rateLimitScope: 'app',
  inviteLimit: 50,
  inviteWindowMs: 60 * 60 * 1000,
  webDist: null,
  allowedOrigins: [],
  trustProxy: false,
};
