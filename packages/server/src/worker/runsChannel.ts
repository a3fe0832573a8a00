import pg from 'pg';
import { sql } from 'kysely';
import type { Database } from '@sigmatail/db';
import type { Kysely, Transaction } from 'kysely';

/** PostgreSQL NOTIFY channel that wakes workers (a run launched) and tells them of cancels. */
export const RUNS_CHANNEL = 'sigmatail_runs';

/** Tells every listening worker that `runId` was launched or changed state. */
export async function notifyRuns(
  db: Kysely<Database> | Transaction<Database>,
  event: 'launched' | 'changed',
  runId: string,
): Promise<void> {
  await sql`select pg_notify(${RUNS_CHANNEL}, ${`${event}:${runId}`})`.execute(db);
}

/**
 * Listens on the runs channel with its own connection, reconnecting after errors. Polling stays
 * the fallback, so a lost notification only delays work by one poll period.
 */
export function listenRuns(
  url: string,
  onEvent: (event: string, runId: string) => void,
  log: (line: string) => void,
): { close: () => Promise<void> } {
  let client: pg.Client | undefined;
  let closed = false;
  let retry: NodeJS.Timeout | undefined;
  const connect = async () => {
    const c = new pg.Client({ connectionString: url });
    client = c;
    c.on('notification', (m) => {
      const [event = '', runId = ''] = (m.payload ?? '').split(':');
      onEvent(event, runId);
    });
    let lost = false;
    const reconnect = (why: string) => {
      if (lost || closed) return;
      lost = true;
      log(`runs channel: ${why}; reconnecting`);
      void c.end().catch(() => undefined);
      retry = setTimeout(() => void connect(), 1000);
    };
    c.on('error', (err) => reconnect(err.message));
    c.on('end', () => reconnect('connection ended'));
    try {
      await c.connect();
      await c.query(`listen ${RUNS_CHANNEL}`);
    } catch (err) {
      reconnect((err as Error).message);
    }
  };
  void connect();
  return {
    close: async () => {
      closed = true;
      clearTimeout(retry);
      await client?.end().catch(() => undefined);
    },
  };
}
