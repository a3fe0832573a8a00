import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildUser } from '../testing/buildUser.js';
import { linkToken, readMail } from '../testing/readMail.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app?.close());

describe('password reset by e-mail, end to end through the SMTP fake', () => {
  it('mails a one-time link that sets a new password and signs out old sessions', async () => {
    const u = await buildUser(app.deps.db);
    const oldSession = await signIn(app, u);
    const res = await app.client().post('/api/auth/forgot', { email: u.email });
    expect(res.status).toBe(200);

    const mail = await readMail(app.deps.db, u.email);
    expect(mail.subject).toMatch(/Reset your Sigmatail password/);
    const token = linkToken(mail.text, 'reset');
    expect(mail.text).toContain(`http://app.test/reset/${token}`);

    const reset = await app.client().post('/api/auth/reset', { token, password: 'brand-new-password' });
    expect(reset.status).toBe(200);
    expect((await oldSession.get('/api/auth/me')).status).toBe(401);
    expect(
      (await app.client().post('/api/auth/login', { email: u.email, password: u.password })).status,
    ).toBe(401);
    await signIn(app, { email: u.email, password: 'brand-new-password' });

    const reuse = await app.client().post('/api/auth/reset', { token, password: 'third-password' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.field).toBe('token');
  });

  it('answers the same whether or not the address has an account, and mails nobody', async () => {
    const u = await buildUser(app.deps.db);
    const known = await app.client().post('/api/auth/forgot', { email: u.email });
    const ghost = `ghost-${randomBytes(5).toString('hex')}@fixture.example`;
    const unknown = await app.client().post('/api/auth/forgot', { email: ghost });
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    await readMail(app.deps.db, u.email);
    await expect(readMail(app.deps.db, ghost, 300)).rejects.toThrow(/no mail/);
  });

  it('refuses an expired link', async () => {
    const u = await buildUser(app.deps.db);
    await app.client().post('/api/auth/forgot', { email: u.email });
    const token = linkToken((await readMail(app.deps.db, u.email)).text, 'reset');
    await app.deps.db
      .updateTable('password_resets')
      .set({ expires_at: new Date(Date.now() - 1000) })
      .where('user_id', '=', u.id)
      .execute();
    const res = await app.client().post('/api/auth/reset', { token, password: 'long-enough-pw' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('token');
    await signIn(app, u); // the old password still works
  });

  it('validates the new password and the token, naming the field', async () => {
    const short = await app.client().post('/api/auth/reset', { token: 'x'.repeat(43), password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.field).toBe('password');
    const bogus = await app
      .client()
      .post('/api/auth/reset', { token: 'x'.repeat(43), password: 'long-enough-pw' });
    expect(bogus.status).toBe(400);
    expect(bogus.body.error.field).toBe('token');
    const email = await app.client().post('/api/auth/forgot', { email: 42 });
    expect(email.status).toBe(400);
    expect(email.body.error.field).toBe('email');
  });
});
