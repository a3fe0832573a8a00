import { createDb } from '@sigmatail/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSmtpMailer, type Mailer } from '../mail/mailer.js';
import { startMailFake, type MailFake } from '../mail/startMailFake.js';
import { readMail } from '../testing/readMail.js';
import { TEST_DATABASE_URL } from '../testing/testDatabaseUrl.js';
import { ChunkQueue } from './chunkQueue.js';
import type { Db } from './runsDb.js';
import { RunWorkStore } from './runWorkStore.js';
import { sendRunNotifications } from './sendRunNotifications.js';
import { buildRun } from './testing/buildRun.js';

let db: Db;
let fake: MailFake;
let mailer: Mailer;

beforeAll(async () => {
  db = createDb(TEST_DATABASE_URL, { max: 3 });
  fake = await startMailFake({ db, port: 0 });
  mailer = createSmtpMailer({ port: fake.port, from: 'Sigmatail <no-reply@sigmatail.example>' });
});
afterAll(async () => {
  mailer?.close();
  await fake?.close();
  await db?.destroy();
});

/** Drives a run to its end the way the worker does (all chunks delivered, then merged). */
async function finishRun(samples: number): Promise<string> {
  const chunkSize = Math.ceil(samples / 2);
  const runId = await buildRun(db, { samples, chunkSize, extrasTasks: 1 });
  const q = new ChunkQueue(db, `notify-${runId}`, 60_000);
  for (const i of [-2, 0, 1]) await q.deliver(runId, i, '{}');
  const stored = await new RunWorkStore(db).storeResults(runId, `notify-${runId}`, {
    json: '{"joint":{"yield":0.9973}}',
    validCount: samples,
    jointYield: 0.9973,
  });
  expect(stored).toBe(true);
  return runId;
}

async function ownerEmail(runId: string): Promise<string> {
  const r = await db
    .selectFrom('runs')
    .innerJoin('users', 'users.id', 'runs.created_by')
    .select('users.email')
    .where('runs.id', '=', runId)
    .executeTakeFirstOrThrow();
  return r.email;
}

describe('run notifications', () => {
  it('mails the owner once, with a link, when a run of more than 1e6 samples finishes', async () => {
    const runId = await finishRun(1_000_001);
    expect(
      (await db.selectFrom('runs').select('notify_state').where('id', '=', runId).executeTakeFirstOrThrow())
        .notify_state,
    ).toBe('pending');
    expect(await sendRunNotifications(db, mailer, 'http://app.test/')).toBeGreaterThanOrEqual(1);
    const mail = await readMail(db, await ownerEmail(runId));
    expect(mail.subject).toMatch(/^Sigmatail run finished: Fixture stage/);
    expect(mail.text).toContain(`http://app.test/runs/${runId}`);
    expect(mail.text).toContain('1,000,001 samples');
    expect(mail.text).toContain('joint yield 99.730 %');
    const row = await db
      .selectFrom('runs')
      .select('notify_state')
      .where('id', '=', runId)
      .executeTakeFirstOrThrow();
    expect(row.notify_state).toBe('sent');
    await sendRunNotifications(db, mailer, 'http://app.test');
    const count = await db
      .selectFrom('dev_mail')
      .select(db.fn.countAll<number>().as('n'))
      .where('text', 'like', `%${runId}%`)
      .executeTakeFirstOrThrow();
    expect(Number(count.n)).toBe(1);
  });

  it('mails on failure too, and not for runs of 1e6 samples or fewer', async () => {
    const failed = await buildRun(db, { samples: 2_000_000, chunkSize: 1_000_000 });
    expect(await new RunWorkStore(db).fail(failed, 'chunk 1 failed: out of memory')).toBe(true);
    const small = await finishRun(1_000_000);
    await sendRunNotifications(db, mailer, 'http://app.test');
    const mail = await readMail(db, await ownerEmail(failed));
    expect(mail.subject).toMatch(/^Sigmatail run failed/);
    expect(mail.text).toContain('chunk 1 failed: out of memory');
    const none = await db
      .selectFrom('dev_mail')
      .select('id')
      .where('mail_to', '=', await ownerEmail(small))
      .execute();
    expect(none).toEqual([]);
  });
});
