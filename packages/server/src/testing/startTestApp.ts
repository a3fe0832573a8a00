import { randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { createDb } from '@sigmatail/db';
import { createApp } from '../app.js';
import type { AppDeps } from '../appDeps.js';
import { DEFAULT_CONFIG, type AppConfig } from '../config.js';
import { createSmtpMailer } from '../mail/mailer.js';
import { startMailFake } from '../mail/startMailFake.js';
import { TestClient } from './testClient.js';
import { TEST_DATABASE_URL } from './testDatabaseUrl.js';

export interface TestApp {
  deps: AppDeps;
  baseUrl: string;
  /** A fresh client with no session. */
  client(): TestClient;
  close(): Promise<void>;
}

/** The real app on port 0, on the test database, with mail going through the real SMTP fake. */
export async function startTestApp(overrides: Partial<AppConfig> = {}): Promise<TestApp> {
  const db = createDb(TEST_DATABASE_URL, { max: 4 });
  const fake = await startMailFake({ db, port: 0 });
  const config: AppConfig = {
    ...DEFAULT_CONFIG,
    secret: randomBytes(32).toString('hex'),
    appUrl: 'http://app.test',
    // Own rate-limit counters: test files run in parallel from one address on one database.
    rateLimitScope: `test-${randomBytes(6).toString('hex')}`,
    ...overrides,
  };
  const mailer = createSmtpMailer({ port: fake.port, from: config.mailFrom });
  const deps: AppDeps = { db, mailer, config };
  const server = createApp(deps).listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    deps,
    baseUrl,
    client: () => new TestClient(baseUrl),
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      mailer.close();
      await fake.close();
      await db.destroy();
    },
  };
}
