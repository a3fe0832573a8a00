import type { AddressInfo } from 'node:net';
import type { Database } from '@sigmatail/db';
import type { Kysely } from 'kysely';
import type { Logger } from 'pino';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface MailFake {
  port: number;
  close(): Promise<void>;
}

function addresses(a: AddressObject | AddressObject[] | undefined): string {
  if (!a) return '';
  return (Array.isArray(a) ? a : [a])
    .flatMap((o) => o.value.map((v) => v.address ?? ''))
    .filter(Boolean)
    .join(', ')
    .toLowerCase();
}

/**
 * A local SMTP server that stores every message it receives in `dev_mail`, so invites and
 * password resets really travel over SMTP in development and tests. The message is stored
 * before the server answers 250, so a sender that awaited sendMail can read it at once.
 * @param port 0 picks a free port (returned).
 */
export async function startMailFake({
  db,
  port,
  host = '127.0.0.1',
  logger,
}: {
  db: Kysely<Database>;
  port: number;
  host?: string;
  /** One line per stored mail and per server error; none when absent. */
  logger?: Logger;
}): Promise<MailFake> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          await db
            .insertInto('dev_mail')
            .values({
              mail_from: addresses(mail.from),
              mail_to: addresses(mail.to),
              subject: mail.subject ?? '',
              text: mail.text ?? '',
              html: typeof mail.html === 'string' ? mail.html : null,
            })
            .execute();
          logger?.info({ to: addresses(mail.to), subject: mail.subject ?? '' }, 'mail stored');
          callback();
        })
        .catch((err: Error) => {
          logger?.error({ err: err.message }, 'mail not stored');
          callback(err);
        });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  server.on('error', (err) =>
    logger ? logger.error({ err: err.message }, 'mail fake error') : console.error('mail fake:', err.message),
  );
  const bound = (server.server.address() as AddressInfo).port;
  return {
    port: bound,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
