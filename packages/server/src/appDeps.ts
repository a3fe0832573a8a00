import type { Database } from '@sigmatail/db';
import type { Kysely } from 'kysely';
import type { Logger } from 'pino';
import type { AppConfig } from './config.js';
import type { Mailer } from './mail/mailer.js';

/** What createApp needs; tests build it with a real database and the SMTP fake. */
export interface AppDeps {
  db: Kysely<Database>;
  mailer: Mailer;
  config: AppConfig;
  /** Structured logger (pino); createApp makes one from LOG_LEVEL when absent. */
  logger?: Logger;
}
