import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './testing/startTestApp.js';

let app: TestApp;
const dist = mkdtempSync(path.join(tmpdir(), 'sigmatail-web-'));
beforeAll(async () => {
  writeFileSync(path.join(dist, 'index.html'), '<!doctype html><title>Sigmatail</title>');
  writeFileSync(path.join(dist, 'app.js'), 'console.log(1)');
  app = await startTestApp({ webDist: dist });
});
afterAll(() => app?.close());

describe('createApp', () => {
  it('serves the built web app with SPA fallback for client routes, never for /api', async () => {
    const c = app.client();
    const page = await c.get('/designs/123/revisions');
    expect(page.status).toBe(200);
    expect(page.body).toContain('<title>Sigmatail</title>');
    expect((await c.get('/app.js')).body).toBe('console.log(1)');
    const api = await c.get('/api/no-such-thing');
    expect(api.status).toBe(404);
    expect(api.body.error.message).toMatch(/no such endpoint/);
  });

  it('answers JSON errors for malformed bodies and unknown methods, never 500', async () => {
    const c = app.client();
    const bad = await c.request('POST', '/api/designs', '{not json');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/^malformed JSON body: it breaks at line 1/);
    const huge = await c.request('POST', '/api/auth/login', JSON.stringify({ email: 'a'.repeat(3_000_000) }));
    expect(huge.status).toBe(413);
    expect((await c.request('PUT', '/api/designs')).status).toBe(404);
    const undecodable = await c.get('/api/designs/%E0%A4%A');
    expect(undecodable.status).toBe(400);
    expect(undecodable.body.error.message).toMatch(/decode/i);
    const notObject = await c.request('POST', '/api/auth/login', '[1,2]');
    expect(notObject.status).toBe(400);
  });
});
