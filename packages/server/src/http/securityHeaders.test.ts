import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';

let app: TestApp;
beforeAll(async () => {
  const dist = mkdtempSync(path.join(tmpdir(), 'sigmatail-web-'));
  writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>t</title>');
  app = await startTestApp({ webDist: dist });
});
afterAll(() => app?.close());

// Header names and values per the Fetch standard (X-Content-Type-Options), RFC 7034
// (X-Frame-Options), CSP Level 3 (frame-ancestors) and the Referrer Policy spec.
function expectHardened(h: Headers): void {
  const csp = h.get('content-security-policy') ?? '';
  expect(csp).toMatch(/default-src 'self'/);
  expect(csp).toMatch(/script-src 'self'/);
  expect(csp).toMatch(/frame-ancestors 'none'/);
  expect(csp).toMatch(/object-src 'none'/);
  expect(csp).not.toMatch(/unsafe-eval/);
  expect(h.get('x-frame-options')).toBe('DENY');
  expect(h.get('x-content-type-options')).toBe('nosniff');
  expect(h.get('referrer-policy')).toBe('no-referrer');
  expect(h.get('x-powered-by')).toBeNull();
}

describe('security headers', () => {
  it('are on the web app (GET /, an SPA route) and on the API, errors included', async () => {
    for (const p of ['/', '/designs/123', '/api/health', '/api/auth/me', '/api/nope']) {
      const res = await fetch(app.baseUrl + p);
      expectHardened(res.headers);
    }
  });

  it('leave out HSTS and upgrade-insecure-requests on plain http', async () => {
    const res = await fetch(app.baseUrl + '/api/health');
    expect(res.headers.get('strict-transport-security')).toBeNull();
    expect(res.headers.get('content-security-policy')).not.toMatch(/upgrade-insecure-requests/);
  });
});

describe('session cookie flags', () => {
  it('Secure only over TLS: X-Forwarded-Proto counts when trust proxy is set, never otherwise', async () => {
    const proxied = await startTestApp({ trustProxy: 'loopback' });
    try {
      const u = await buildUser(proxied.deps.db);
      const login = (headers: Record<string, string>) =>
        fetch(proxied.baseUrl + '/api/auth/login', {
          method: 'POST',
          headers: { 'content-type': 'application/json', ...headers },
          body: JSON.stringify({ email: u.email, password: u.password }),
        });
      const tls = (await login({ 'x-forwarded-proto': 'https' })).headers.getSetCookie().join();
      expect(tls).toMatch(/HttpOnly/i);
      expect(tls).toMatch(/SameSite=Lax/i);
      expect(tls).toMatch(/Secure/i);
      const plain = (await login({})).headers.getSetCookie().join();
      expect(plain).not.toMatch(/Secure/i);
    } finally {
      await proxied.close();
    }
    // Without trust proxy a client cannot claim TLS by header.
    const u = await buildUser(app.deps.db);
    const res = await fetch(app.baseUrl + '/api/auth/login', {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-proto': 'https' },
      body: JSON.stringify({ email: u.email, password: u.password }),
    });
    expect(res.headers.getSetCookie().join()).not.toMatch(/Secure/i);
  });
});
