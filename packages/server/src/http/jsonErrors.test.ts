import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';
import type { ErrorBody } from './errorHandler.js';

let app: TestApp;
let engineer: TestClient;
beforeAll(async () => {
  app = await startTestApp();
  engineer = await signIn(app, await buildUser(app.deps.db, { role: 'engineer' }));
});
afterAll(() => app?.close());

async function send(p: string, headers: Record<string, string>, body: string | Buffer) {
  const res = await fetch(app.baseUrl + p, {
    method: 'POST',
    headers: { cookie: engineer.cookie!, ...headers },
    body,
  });
  expect(res.headers.get('content-type')).toMatch(/application\/json/);
  return { status: res.status, body: (await res.json()) as ErrorBody };
}

describe('JSON errors for bodies the API cannot read', () => {
  it('malformed JSON: 400 naming the body and where it breaks', async () => {
    const res = await send(
      '/api/designs',
      { 'content-type': 'application/json' },
      '{\n  "document": {"name": tru}\n}',
    );
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ field: 'body', line: 2, column: 27, position: 28 });
    expect(res.body.error.message).toMatch(/malformed JSON body: it breaks at line 2, column 27/);
  });

  it('wrong content type: 415 naming Content-Type (form posts, text)', async () => {
    for (const type of ['application/x-www-form-urlencoded', 'text/plain', 'application/xml']) {
      const res = await send('/api/designs', { 'content-type': type }, 'document=1');
      expect(res.status, type).toBe(415);
      expect(res.body.error.field).toBe('Content-Type');
      expect(res.body.error.message).toMatch(/application\/json/);
    }
    const none = await fetch(app.baseUrl + '/api/designs', {
      method: 'POST',
      headers: { cookie: engineer.cookie! },
      body: new Uint8Array([123, 125]),
    });
    expect(none.status).toBe(415);
    // Upload types pass the gate (for routes that take files); a JSON route then finds no body.
    const upload = await send('/api/designs', { 'content-type': 'multipart/form-data; boundary=x' }, '--x--');
    expect(upload.status).toBe(400);
    expect(upload.body.error.field).toBeTruthy();
  });

  it('oversized: 413 naming the limit', async () => {
    const huge = JSON.stringify({ document: { notes: 'x'.repeat(2 * 1024 * 1024 + 10) } });
    const res = await send('/api/designs', { 'content-type': 'application/json' }, huge);
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ field: 'body' });
    expect(res.body.error.message).toMatch(/too large.*2 MB/);
  });

  it('a body that is not an object: 400 naming the body', async () => {
    for (const raw of ['[]', '"text"', '42', 'null']) {
      const res = await send('/api/designs', { 'content-type': 'application/json' }, raw);
      expect(res.status, raw).toBe(400);
      expect(res.body.error.field, raw).toBeTruthy();
    }
  });

  it('an empty body with no content type is fine where the body is optional', async () => {
    const res = await fetch(app.baseUrl + '/api/auth/logout', { method: 'POST' });
    expect(res.status).toBe(204);
  });
});
