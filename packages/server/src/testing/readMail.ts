import type { Database } from '@sigmatail/db';
import type { Kysely } from 'kysely';

/**
 * The newest mail the SMTP fake stored for `to`, waiting up to `timeoutMs` (some mail is sent
 * after the HTTP answer, e.g. password resets).
 */
export async function readMail(db: Kysely<Database>, to: string, timeoutMs = 5000) {
  const until = Date.now() + timeoutMs;
  while (true) {
    const mail = await db
      .selectFrom('dev_mail')
      .selectAll()
      .where('mail_to', '=', to.toLowerCase())
      .orderBy('received_at', 'desc')
      .executeTakeFirst();
    if (mail) return mail;
    if (Date.now() > until) throw new Error(`no mail for ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The token at the end of the first APP_URL/<kind>/<token> link in a mail text. */
export function linkToken(text: string, kind: 'invite' | 'reset'): string {
  const m = new RegExp(`/${kind}/([A-Za-z0-9_-]+)`).exec(text);
  if (!m) throw new Error(`no ${kind} link in mail: ${text}`);
  return m[1]!;
}
