import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readEnvConfig, readSecret } from './readEnvConfig.js';

describe('readEnvConfig', () => {
  it('applies the documented defaults', () => {
    const c = readEnvConfig({ SIGMATAIL_SECRET: 's'.repeat(40) });
    expect(c).toMatchObject({
      port: 3000,
      smtpPort: 2525,
      appUrl: 'http://127.0.0.1:3000',
      cookieSecure: false,
    });
    expect(c.databaseUrl).toMatch(/^postgres:\/\//);
  });

  it('reads PORT, SMTP_PORT, APP_URL (https → Secure cookie) and refuses a malformed port', () => {
    const c = readEnvConfig({
      SIGMATAIL_SECRET: 's'.repeat(40),
      PORT: '3100',
      SMTP_PORT: '2600',
      APP_URL: 'https://amp.example/',
    });
    expect(c).toMatchObject({
      port: 3100,
      smtpPort: 2600,
      appUrl: 'https://amp.example',
      cookieSecure: true,
    });
    expect(() => readEnvConfig({ SIGMATAIL_SECRET: 'x', PORT: 'eighty' })).toThrow(
      'PORT must be a port number, got "eighty"',
    );
  });
});

describe('readSecret', () => {
  it('makes a random secret once in the data folder and reuses it', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'sigmatail-secret-'));
    const first = readSecret({}, dir);
    expect(first.length).toBeGreaterThanOrEqual(32);
    expect(readFileSync(path.join(dir, 'secret'), 'utf8').trim()).toBe(first);
    expect(readSecret({}, dir)).toBe(first);
    expect(readSecret({ SIGMATAIL_SECRET: 'from-env' }, dir)).toBe('from-env');
  });
});
