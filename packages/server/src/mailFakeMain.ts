// Process entry for the local SMTP fake: stores every mail to 127.0.0.1:SMTP_PORT in dev_mail.
import { createDb, ensureDatabase, migrateToLatest } from '@sigmatail/db';
import { createLogger } from './http/logger.js';
import { startMailFake } from './mail/startMailFake.js';
import { readEnvConfig } from './readEnvConfig.js';

// One JSON line per event (pino), like the API server and the worker.
const logger = createLogger('sigmatail-mail-fake');

async function main(): Promise<void> {
  const config = readEnvConfig();
  await ensureDatabase(config.databaseUrl);
  const db = createDb(config.databaseUrl, { max: 2 });
  await migrateToLatest(db);
  let fake;
  try {
    fake = await startMailFake({ db, port: config.smtpPort, logger });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'EADDRINUSE') {
      logger.error({ port: config.smtpPort }, 'port already in use: stop the other process or set SMTP_PORT');
      process.exit(1);
    }
    throw err;
  }
  logger.info({ url: `smtp://127.0.0.1:${fake.port}` }, 'mail fake listening');
  const stop = (): void => {
    void fake
      .close()
      .then(() => db.destroy())
      .finally(() => process.exit(0));
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((err: unknown) => {
  logger.error({ err: err instanceof Error ? err.message : String(err) }, 'mail fake failed to start');
  process.exit(1);
});
