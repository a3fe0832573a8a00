// Process entry: read env, migrate, optionally seed the demo, serve on 127.0.0.1:PORT.
import type { AddressInfo } from 'node:net';
import { createDb, ensureDatabase, migrateToLatest, seedDemo } from '@sigmatail/db';
import { createApp } from './app.js';
import { createLogger } from './http/logger.js';
import { createSmtpMailer } from './mail/mailer.js';
import { startMailFake } from './mail/startMailFake.js';
import { readEnvConfig } from './readEnvConfig.js';

function fail(message: string): never {
  console.error(message);
  process.exit(1);
}

/** The URL without its password, for messages. */
function redact(url: string): string {
  try {
    const u = new URL(url);
    if (u.password) u.password = '***';
    return u.toString();
  } catch {
    return '(unparseable DATABASE_URL)';
  }
}

async function main(): Promise<void> {
  let config;
  try {
    config = readEnvConfig();
  } catch (err) {
    fail((err as Error).message);
  }
  try {
    await ensureDatabase(config.databaseUrl);
  } catch (err) {
    fail(`cannot reach PostgreSQL at ${redact(config.databaseUrl)}: ${(err as Error).message}`);
  }
  const logger = createLogger();
  // A database that stops answering on an open connection fails the request (503) after 15 s
  // instead of holding it; new connections give up after 2 s (createDb's default).
  const db = createDb(config.databaseUrl, { queryTimeoutMillis: 15_000 });
  await migrateToLatest(db);
  if (process.env.SIGMATAIL_SEED_DEMO === '1') await seedDemo(db);
  // SIGMATAIL_MAIL_FAKE=1 runs the SMTP fake in this process instead of `mailFakeMain`.
  let smtpPort = config.smtpPort;
  if (process.env.SIGMATAIL_MAIL_FAKE === '1')
    smtpPort = (await startMailFake({ db, port: smtpPort, logger })).port;
  const mailer = createSmtpMailer({ port: smtpPort, from: config.mailFrom });
  const app = createApp({ db, mailer, config, logger });

  const server = app.listen(config.port, '127.0.0.1');
  server.on('error', (err: NodeJS.ErrnoException) => {
    if (err.code === 'EADDRINUSE') {
      fail(`port ${config.port} is already in use — stop the other process or set PORT`);
    }
    fail(`cannot listen on port ${config.port}: ${err.message}`);
  });
  server.on('listening', () => {
    const { port } = server.address() as AddressInfo;
    console.log(`sigmatail server on http://127.0.0.1:${port}`);
    logger.info({ port }, 'listening');
  });

  // Graceful shutdown: stop accepting, let requests in flight finish (at most 10 s), then close
  // idle keep-alive connections, the mailer and the pool.
  const stop = (signal: string): void => {
    logger.info({ signal }, 'shutting down: finishing requests in flight');
    const force = setTimeout(() => {
      logger.warn('requests still open after 10 s; closing them');
      server.closeAllConnections();
    }, 10_000).unref();
    server.close(() => {
      clearTimeout(force);
      mailer.close();
      void db.destroy().finally(() => {
        logger.info('stopped');
        process.exit(0);
      });
    });
    server.closeIdleConnections();
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err: unknown) =>
  fail(`server failed to start: ${err instanceof Error ? err.message : String(err)}`),
);
