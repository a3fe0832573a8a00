import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_CONFIG, type AppConfig } from './config.js';

/** Repository root (this file is packages/server/src/x.ts or packages/server/dist/x.js). */
export const REPO_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

export interface EnvConfig extends AppConfig {
  databaseUrl: string;
  port: number;
  smtpPort: number;
}

function intEnv(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0 || n > 65535)
    throw new Error(`${name} must be a port number, got "${raw}"`);
  return n;
}

/**
 * The secret from SIGMATAIL_SECRET, else one made once and kept in .data/secret (gitignored),
 * so sessions survive a restart without anyone having to configure anything.
 */
export function readSecret(env: NodeJS.ProcessEnv, dataDir = path.join(REPO_ROOT, '.data')): string {
  if (env.SIGMATAIL_SECRET) return env.SIGMATAIL_SECRET;
  const file = path.join(dataDir, 'secret');
  if (existsSync(file)) {
    const s = readFileSync(file, 'utf8').trim();
    if (s.length >= 32) return s;
  }
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

/** SIGMATAIL_TRUST_PROXY: unset/false, true, a hop count, or Express's names ('loopback', addresses). */
function trustProxyEnv(raw: string | undefined): boolean | number | string {
  if (raw === undefined || raw === '' || raw === 'false' || raw === '0') return false;
  if (raw === 'true') return true;
  return /^\d+$/.test(raw) ? Number(raw) : raw;
}

/**
 * Reads DATABASE_URL, PORT, SMTP_PORT, APP_URL, SIGMATAIL_SECRET, SIGMATAIL_ALLOWED_ORIGINS
 * (comma-separated), SIGMATAIL_TRUST_PROXY (see README).
 */
export function readEnvConfig(env: NodeJS.ProcessEnv = process.env): EnvConfig {
  const appUrl = (env.APP_URL || DEFAULT_CONFIG.appUrl).replace(/\/+$/, '');
  return {
    ...DEFAULT_CONFIG,
    databaseUrl: env.DATABASE_URL || 'postgres://postgres@127.0.0.1:55432/sigmatail',
    port: intEnv(env, 'PORT', 3000),
    smtpPort: intEnv(env, 'SMTP_PORT', 2525),
    appUrl,
    cookieSecure: appUrl.startsWith('https:'),
    secret: readSecret(env),
    webDist: path.join(REPO_ROOT, 'packages/web/dist'),
    allowedOrigins: (env.SIGMATAIL_ALLOWED_ORIGINS ?? '')
      .split(',')
      .map((o) => o.trim())
      .filter(Boolean),
    trustProxy: trustProxyEnv(env.SIGMATAIL_TRUST_PROXY),
  };
}
