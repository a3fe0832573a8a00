import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { readMail } from '../testing/readMail.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';

// Two app instances on one database (what two server processes are), both trusting
// X-Forwarded-For so a test can speak from several addresses.
let a: TestApp;
let b: TestApp;
beforeAll(async () => {
  const secret = randomBytes(32).toString('hex');
  const config = {
    secret,
    rateLimitScope: `test-${randomBytes(6).toString('hex')}`,
    trustProxy: true,
    loginLimit: 3,
    loginSourceLimit: 5,
  };
  a = await startTestApp(config);
  b = await startTestApp(config);
});
afterAll(async () => {
  await a?.close();
  await b?.close();
});

let n = 0;
/** A fresh documentation address (RFC 5737 TEST-NET-3) per call, so tests never share a source. */
const newSource = (): string => `203.0.113.${(n++ % 250) + 1}`;

async function login(app: TestApp, from: string, email: string, password: string) {
  const res = await fetch(app.baseUrl + '/api/auth/login', {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-forwarded-for': from },
    body: JSON.stringify({ email, password }),
  });
  return {
    status: res.status,
    retryAfter: res.headers.get('retry-after'),
    body: (await res.json()) as { error?: { message: string } },
  };
}

describe('sign-in throttling', () => {
  it('a stranger failing against an account cannot lock its owner out', async () => {
    const u = await buildUser(a.deps.db);
    const stranger = newSource();
    const statuses = [];
    for (let i = 0; i < 5; i++) statuses.push((await login(a, stranger, u.email, 'guess-' + i)).status);
    expect(statuses).toEqual([401, 401, 401, 429, 429]);
    // The stranger is held back even with the right password; the owner from elsewhere is not.
    expect((await login(a, stranger, u.email, u.password)).status).toBe(429);
    expect((await login(a, newSource(), u.email, u.password)).status).toBe(200);
  });

  it('429 says why and when to come back (Retry-After in seconds)', async () => {
    const u = await buildUser(a.deps.db);
    const from = newSource();
    for (let i = 0; i < 3; i++) await login(a, from, u.email, 'nope-nope');
    const blocked = await login(a, from, u.email, 'nope-nope');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error?.message).toMatch(/too many failed sign-ins/);
    expect(Number(blocked.retryAfter)).toBeGreaterThan(0);
    expect(Number(blocked.retryAfter)).toBeLessThanOrEqual(15 * 60);
  });

  it('one source trying many accounts (password spraying) is throttled', async () => {
    const from = newSource();
    const statuses = [];
    for (let i = 0; i < 7; i++) {
      statuses.push(
        (await login(a, from, `spray-${i}-${randomBytes(3).toString('hex')}@fixture.example`, 'Summer2026!'))
          .status,
      );
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429]);
  });

  it('a correct sign-in forgives that source its earlier failures on the account', async () => {
    const u = await buildUser(a.deps.db);
    const from = newSource();
    for (let i = 0; i < 2; i++) await login(a, from, u.email, 'typo-typo');
    expect((await login(a, from, u.email, u.password)).status).toBe(200);
    for (let i = 0; i < 2; i++) expect((await login(a, from, u.email, 'typo-typo')).status).toBe(401);
  });

  it('the limits hold across server processes: failures on one instance count on the other', async () => {
    const u = await buildUser(a.deps.db);
    const from = newSource();
    expect((await login(a, from, u.email, 'x-wrong-1')).status).toBe(401);
    expect((await login(b, from, u.email, 'x-wrong-2')).status).toBe(401);
    expect((await login(a, from, u.email, 'x-wrong-3')).status).toBe(401);
    expect((await login(b, from, u.email, u.password)).status).toBe(429);
    // Reset mails: half the sign-in limit per (address, source); one source, two instances.
    const src = newSource();
    const send = (app: TestApp) =>
      fetch(app.baseUrl + '/api/auth/forgot', {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-forwarded-for': src },
        body: JSON.stringify({ email: u.email }),
      }).then((r) => r.status);
    expect([await send(a), await send(b)]).toEqual([200, 429]);
  });

  it('invites: a workspace past its invite limit gets 429', async () => {
    const limited = await startTestApp({ inviteLimit: 2 });
    try {
      const admin = await buildUser(limited.deps.db, { role: 'admin' });
      const client = limited.client();
      expect(
        (await client.post('/api/auth/login', { email: admin.email, password: admin.password })).status,
      ).toBe(200);
      const statuses = [];
      for (let i = 0; i < 3; i++) {
        statuses.push(
          (
            await client.post('/api/invites', {
              email: `inv-${i}-${randomBytes(3).toString('hex')}@fixture.example`,
              role: 'viewer',
            })
          ).status,
        );
      }
      expect(statuses).toEqual([201, 201, 429]);
    } finally {
      await limited.close();
    }
  });
});

describe('link token guessing', () => {
  it('a source trying many invalid invite or reset links gets 429; others are not affected', async () => {
    const from = newSource();
    const get = (src: string) =>
      fetch(`${a.baseUrl}/api/invites/${randomBytes(24).toString('base64url')}`, {
        headers: { 'x-forwarded-for': src },
      });
    const statuses = [];
    for (let i = 0; i < 10; i++) statuses.push((await get(from)).status);
    expect(statuses).toEqual(Array(10).fill(404));
    // 2 × loginSourceLimit (5) failures; the reset form counts against the same allowance.
    const reset = await fetch(`${b.baseUrl}/api/auth/reset`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-forwarded-for': from },
      body: JSON.stringify({ token: randomBytes(24).toString('base64url'), password: 'long-enough-pw-1' }),
    });
    expect(reset.status).toBe(429);
    expect((await get(newSource())).status).toBe(404);
  });
});

describe('password policy', () => {
  it('hashes new passwords at bcrypt cost >= 10 and refuses short, e-mail-like or common ones, naming the field', async () => {
    const admin = await buildUser(a.deps.db, { role: 'admin' });
    const client = a.client();
    await client.post('/api/auth/login', { email: admin.email, password: admin.password });
    const email = `policy-${randomBytes(4).toString('hex')}@fixture.example`;
    expect((await client.post('/api/invites', { email, role: 'viewer' })).status).toBe(201);
    const mail = await readMail(a.deps.db, email);
    const token = /\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text)![1]!;
    const accept = (password: string) =>
      a.client().post('/api/auth/accept-invite', { token, name: 'Pol Icy', password });
    for (const [password, why] of [
      ['short-pw', /at least 10 characters/],
      [email, /e-mail/],
      [`${email.split('@')[0]}-2026`, /e-mail/],
      ['Password123', /too common/],
      ['aaaaaaaaaaaa', /too common/],
    ] as const) {
      const res = await accept(password);
      expect(res.status, password).toBe(400);
      expect(res.body.error.field).toBe('password');
      expect(res.body.error.message).toMatch(why);
    }
    expect((await accept('cathode-bias-17')).status).toBe(200);
    const row = await a.deps.db
      .selectFrom('users')
      .select('password_hash')
      .where('email', '=', email)
      .executeTakeFirstOrThrow();
    // bcrypt's modular-crypt format $2b$<cost>$… (cost as two digits).
    expect(Number(/^\$2[aby]\$(\d\d)\$/.exec(row.password_hash)![1])).toBeGreaterThanOrEqual(10);
  });
});
