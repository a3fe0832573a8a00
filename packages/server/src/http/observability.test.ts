import { randomBytes } from 'node:crypto';
import { createServer, type AddressInfo, type Socket } from 'node:net';
import { Writable } from 'node:stream';
import { createDb } from '@sigmatail/db';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../app.js';
import { DEFAULT_CONFIG } from '../config.js';
import { createSmtpMailer } from '../mail/mailer.js';
import { buildUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app?.close());

/** An app on a database that cannot be reached, listening on a free port. */
async function unreachableApp(url: string, secret = randomBytes(32).toString('hex')) {
  const db = createDb(url, { max: 2 });
  const config = { ...DEFAULT_CONFIG, secret };
  const mailer = createSmtpMailer({ port: 9, from: config.mailFrom });
  const server = createApp({ db, mailer, config }).listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
  return {
    base,
    async close() {
      await new Promise((r) => server.close(r));
      mailer.close();
      await db.destroy();
    },
  };
}

describe('health and readiness probes', () => {
  it('/healthz: the process is up; /readyz: database reachable and migrations current', async () => {
    const live = await fetch(app.baseUrl + '/healthz');
    expect(live.status).toBe(200);
    expect(await live.json()).toMatchObject({ ok: true });
    const ready = await fetch(app.baseUrl + '/readyz');
    expect(ready.status).toBe(200);
    expect(await ready.json()).toEqual({ ok: true, db: 'up', migrations: { pending: [] } });
  });

  it('/readyz answers 503 JSON, and API requests 503 JSON, while the database is unreachable', async () => {
    // Port 1 on loopback: nothing listens, the connect is refused at once.
    const down = await unreachableApp('postgres://postgres@127.0.0.1:1/sigmatail');
    try {
      expect((await fetch(down.base + '/healthz')).status).toBe(200);
      const ready = await fetch(down.base + '/readyz');
      expect(ready.status).toBe(503);
      expect(((await ready.json()) as { db: string }).db).toBe('down');
      for (const [method, p, body] of [
        ['POST', '/api/auth/login', { email: 'a@b.example', password: 'whatever-it-is' }],
        ['GET', '/api/health', undefined],
        ['GET', '/api/invites/0123456789abcdef0123', undefined],
      ] as const) {
        const res = await fetch(down.base + p, {
          method,
          headers: body ? { 'content-type': 'application/json' } : {},
          body: body ? JSON.stringify(body) : undefined,
        });
        expect(res.status, p).toBe(503);
        const json = (await res.json()) as { error?: { message: string }; ok?: boolean };
        if (p !== '/api/health') expect(json.error?.message).toMatch(/database is unavailable/);
      }
    } finally {
      await down.close();
    }
  });

  it('a database that accepts connections but never answers: 503 after the connect timeout, no hang', async () => {
    const sockets = new Set<Socket>();
    const silent = createServer((socket) => sockets.add(socket)); // accepts, never speaks
    await new Promise<void>((r) => silent.listen(0, '127.0.0.1', () => r()));
    const { port } = silent.address() as AddressInfo;
    const down = await unreachableApp(`postgres://postgres@127.0.0.1:${port}/sigmatail`);
    try {
      // The abort only turns a hang into a failure here; the pool gives up after 2 s by itself.
      const res = await fetch(down.base + '/api/auth/login', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: 'a@b.example', password: 'whatever-it-is' }),
        signal: AbortSignal.timeout(20_000),
      });
      expect(res.status).toBe(503);
      expect(res.headers.get('retry-after')).toBe('5');
      expect((await fetch(down.base + '/readyz', { signal: AbortSignal.timeout(20_000) })).status).toBe(503);
    } finally {
      await down.close();
      for (const s of sockets) s.destroy();
      await new Promise((r) => silent.close(r));
    }
  });

  it('a signed-in request whose session cannot be checked gets 503, not 500', async () => {
    const u = await buildUser(app.deps.db);
    const client = await signIn(app, u);
    const down = await unreachableApp('postgres://postgres@127.0.0.1:1/sigmatail', app.deps.config.secret);
    try {
      const res = await fetch(down.base + '/api/designs', { headers: { cookie: client.cookie! } });
      expect(res.status).toBe(503);
    } finally {
      await down.close();
    }
  });
});

describe('request ids and structured logs', () => {
  it('every answer carries X-Request-Id; a well-formed id from the caller is kept, a bad one replaced', async () => {
    const fresh = await fetch(app.baseUrl + '/api/auth/me');
    expect(fresh.headers.get('x-request-id')).toMatch(/^[0-9a-f-]{36}$/);
    const given = await fetch(app.baseUrl + '/api/auth/me', { headers: { 'x-request-id': 'edge-42.abc' } });
    expect(given.headers.get('x-request-id')).toBe('edge-42.abc');
    const bad = await fetch(app.baseUrl + '/api/auth/me', { headers: { 'x-request-id': 'x'.repeat(300) } });
    expect(bad.headers.get('x-request-id')).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('logs one JSON line per request with its id, status and time, cookies redacted', async () => {
    const lines: Record<string, unknown>[] = [];
    const sink = new Writable({
      write(chunk: Buffer, _enc, done) {
        for (const l of chunk.toString().split('\n').filter(Boolean))
          lines.push(JSON.parse(l) as Record<string, unknown>);
        done();
      },
    });
    const logger = pino({ level: 'info' }, sink);
    const server = createApp({ ...app.deps, logger }).listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    try {
      const base = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
      const res = await fetch(base + '/api/auth/me', {
        headers: { cookie: 'sigmatail_session=secret-value' },
      });
      const id = res.headers.get('x-request-id');
      await new Promise((r) => setTimeout(r, 50));
      const line = lines.find((l) => (l.req as { id?: string } | undefined)?.id === id);
      expect(line).toBeTruthy();
      expect(line).toMatchObject({ level: 40, res: { statusCode: 401 } });
      expect(typeof line!.responseTime).toBe('number');
      expect(JSON.stringify(line)).not.toContain('secret-value');
    } finally {
      await new Promise((r) => server.close(r));
    }
  });
});
