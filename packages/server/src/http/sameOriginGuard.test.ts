import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';
import type { ErrorBody } from './errorHandler.js';

let app: TestApp;
let engineer: TestClient;
beforeAll(async () => {
  app = await startTestApp({ allowedOrigins: ['https://sigmatail.example.org'] });
  engineer = await signIn(app, await buildUser(app.deps.db, { role: 'engineer' }));
});
afterAll(() => app?.close());

/** A request as a browser would send it with the engineer's cookie. */
function send(method: string, p: string, headers: Record<string, string>, body?: string) {
  return fetch(app.baseUrl + p, {
    method,
    headers: { cookie: engineer.cookie!, ...headers },
    body,
    redirect: 'manual',
  });
}

const designCount = async (): Promise<number> =>
  Number(
    (
      await app.deps.db
        .selectFrom('designs')
        .select((eb) => eb.fn.countAll().as('n'))
        .executeTakeFirstOrThrow()
    ).n,
  );

describe('cross-site state-changing requests', () => {
  it('are refused with 403 JSON naming the Origin, and change nothing', async () => {
    const before = await designCount();
    const res = await send(
      'POST',
      '/api/designs',
      { 'content-type': 'application/json', origin: 'http://evil.example', 'sec-fetch-site': 'cross-site' },
      JSON.stringify({ document: {} }),
    );
    expect(res.status).toBe(403);
    const body = (await res.json()) as ErrorBody;
    expect(body.error.message).toMatch(/cross-site request refused.*http:\/\/evil\.example/);
    expect(body.error.field).toBe('Origin');
    expect(await designCount()).toBe(before);
    for (const [method, p] of [
      ['POST', '/api/runs'],
      ['PATCH', '/api/workspace'],
      ['DELETE', `/api/users/${crypto.randomUUID()}`],
      ['POST', '/api/auth/logout'],
    ] as const) {
      const r = await send(
        method,
        p,
        { 'content-type': 'application/json', origin: 'http://evil.example' },
        '{}',
      );
      expect(r.status, `${method} ${p}`).toBe(403);
    }
  });

  it('refuses a cross-origin HTML form post (urlencoded, Origin of the other site)', async () => {
    const res = await send(
      'POST',
      '/api/auth/logout',
      {
        'content-type': 'application/x-www-form-urlencoded',
        origin: 'http://evil.example',
        'sec-fetch-site': 'cross-site',
      },
      'everywhere=true',
    );
    expect(res.status).toBe(403);
    expect((await engineer.get('/api/auth/me')).status).toBe(200);
  });

  it('refuses Origin: null (sandboxed frames, file: pages) and Sec-Fetch-Site cross-site without Origin', async () => {
    expect((await send('POST', '/api/auth/logout', { origin: 'null' })).status).toBe(403);
    const r = await send('POST', '/api/auth/logout', { 'sec-fetch-site': 'cross-site' });
    expect(r.status).toBe(403);
    expect(((await r.json()) as ErrorBody).error.field).toBe('Sec-Fetch-Site');
  });

  it('lets the app itself, configured origins and non-browser clients through; reads are never refused', async () => {
    const own = await send(
      'POST',
      '/api/auth/workspace',
      {
        'content-type': 'application/json',
        origin: app.baseUrl,
        'sec-fetch-site': 'same-origin',
      },
      '{}',
    );
    expect(own.status).toBe(400); // past the guard: the body is checked
    const appUrl = await send(
      'POST',
      '/api/auth/workspace',
      { 'content-type': 'application/json', origin: 'http://app.test' },
      '{}',
    );
    expect(appUrl.status).toBe(400);
    const configured = await send(
      'POST',
      '/api/auth/workspace',
      {
        'content-type': 'application/json',
        origin: 'https://sigmatail.example.org',
      },
      '{}',
    );
    expect(configured.status).toBe(400);
    const cli = await send('POST', '/api/auth/workspace', { 'content-type': 'application/json' }, '{}');
    expect(cli.status).toBe(400);
    const read = await send('GET', '/api/auth/me', {
      origin: 'http://evil.example',
      'sec-fetch-site': 'cross-site',
    });
    expect(read.status).toBe(200);
  });
});
