import type { Request } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type { AppConfig } from '../config.js';
import type { ThrottleRule } from './throttle.js';

/** The source of a request as a rate-limit key (IPv6 grouped by /56, so one host cannot rotate addresses). */
export function sourceKey(req: Request): string {
  return ipKeyGenerator(req.ip ?? 'unknown');
}

/**
 * Failed sign-ins counted per (account, source) and per source across accounts. A stranger
 * failing against an account only blocks themselves: the owner signing in from another address is
 * never refused. One address trying many accounts (password spraying) hits the per-source limit.
 */
export function loginRules(config: AppConfig, email: string, source: string): [ThrottleRule, ThrottleRule] {
  return [
    { key: `login:acct:${email}|${source}`, limit: config.loginLimit, windowMs: config.loginWindowMs },
    { key: `login:src:${source}`, limit: config.loginSourceLimit, windowMs: config.loginWindowMs },
  ];
}

/** Reset requests (every one counts): per (address, source), and per source across addresses. */
export function forgotRules(config: AppConfig, email: string, source: string): ThrottleRule[] {
  return [
    {
      key: `forgot:acct:${email}|${source}`,
      limit: Math.max(1, Math.floor(config.loginLimit / 2)),
      windowMs: config.loginWindowMs,
    },
    { key: `forgot:src:${source}`, limit: config.loginSourceLimit, windowMs: config.loginWindowMs },
  ];
}

/** Invites sent per workspace (each one is a mail to an outside address). */
export function inviteRules(config: AppConfig, workspaceId: string): ThrottleRule[] {
  return [{ key: `invite:ws:${workspaceId}`, limit: config.inviteLimit, windowMs: config.inviteWindowMs }];
}

/** Invalid invite or reset links tried per source (guessing tokens): twice the sign-in allowance. */
export function tokenRules(config: AppConfig, source: string): ThrottleRule[] {
  return [{ key: `token:src:${source}`, limit: 2 * config.loginSourceLimit, windowMs: config.loginWindowMs }];
}
