import type { Database } from '@sigmatail/db';
import { sql, type Kysely } from 'kysely';
import type { Mailer } from '../mail/mailer.js';

/**
 * Mails the owners of finished or failed large runs (notify_state 'pending', set in the same
 * transaction that ended the run). Each run is locked while its mail goes out and marked 'sent'
 * after, so two workers never both mail it; a crash in between mails again (at least once).
 * Returns how many mails were sent.
 */
export async function sendRunNotifications(
  db: Kysely<Database>,
  mailer: Mailer,
  appUrl: string,
): Promise<number> {
  let sent = 0;
  for (;;) {
    const done = await db.transaction().execute(async (trx) => {
      const { rows } = await sql<{
        id: string;
        status: string;
        samples: number;
        error: string | null;
        email: string;
        name: string;
        design_name: string;
        revision: number;
        joint_yield: number | null;
      }>`
        select r.id, r.status, r.samples, r.error, u.email, u.name, d.name as design_name, r.revision, rr.joint_yield
        from runs r join users u on u.id = r.created_by join designs d on d.id = r.design_id
        left join run_results rr on rr.run_id = r.id
        where r.notify_state = 'pending'
        order by r.finished_at limit 1
        for update of r skip locked`.execute(trx);
      const run = rows[0];
      if (!run) return false;
      const link = `${appUrl.replace(/\/$/, '')}/runs/${run.id}`;
      const what = `${run.design_name} (revision ${run.revision}), ${run.samples.toLocaleString('en-US')} samples`;
      const outcome =
        run.status === 'done'
          ? `finished${run.joint_yield === null ? '' : `: joint yield ${(run.joint_yield * 100).toFixed(3)} %`}`
          : `${run.status}${run.error ? `: ${run.error}` : ''}`;
      await mailer.send({
        to: run.email,
        subject: `Sigmatail run ${run.status === 'done' ? 'finished' : run.status}: ${run.design_name}`,
        text: `Hello ${run.name},\n\nYour run of ${what} ${outcome}.\n\nOpen it: ${link}\n\n— Sigmatail\n`,
      });
      await trx.updateTable('runs').set({ notify_state: 'sent' }).where('id', '=', run.id).execute();
      return true;
    });
    if (!done) return sent;
    sent++;
  }
}
