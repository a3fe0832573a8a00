// Process entry for the local SMTP fake: stores every mail to 127.0.0.1:SMTP_PORT in dev_mail.
import { createDb, ensureDatabase, migrateToLatest } from '@sigmatail/db';
import { startMailFake } from './mail/startMailFake.js';
import { readEnvConfig } from './readEnvConfig.js';

async function main(): Promise<void> {
  const config = readEnvConfig();
  await ensureDatabase(config.databaseUrl);
  const db = createDb(config.databaseUrl, { max: 2 });
  await migrateToLatest(db);
  let fake;
  try {
    fake = await startMailFake({ db, port: config.smtpPort });
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'EADDRINUSE') {
      console.error(`port ${config.smtpPort} is already in use — stop the other process or set SMTP_PORT`);
      process.exit(1);
    }
    throw err;
  }
  console.log(`sigmatail mail fake on smtp://127.0.0.1:${fake.port}`);
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
  console.error(`mail fake failed to start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
