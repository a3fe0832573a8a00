import type { Database } from '@sigmatail/db';
import { Router } from 'express';
import type { ExpressionBuilder } from 'kysely';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { requireRole } from '../auth/requireRole.js';
import { HttpError } from '../http/httpError.js';
import { uuidParam } from '../http/uuidParam.js';

const listQuery = z.object({
  to: z.string().trim().toLowerCase().max(254).optional(),
  limit: z.coerce.number().int('must be a whole number').min(1).max(500).default(100),
});

/**
 * Mail of one workspace: addressed to one of its members or to an address it invited. The SMTP
 * fake stores every mail in one table; an admin must not read another workspace's invite or
 * reset links there.
 */
function forWorkspace(workspaceId: string) {
  return (eb: ExpressionBuilder<Database, 'dev_mail'>) =>
    eb.or([
      eb(
        'mail_to',
        'in',
        eb
          .selectFrom('users as u')
          .innerJoin('memberships as m', 'm.user_id', 'u.id')
          .select('u.email')
          .where('m.workspace_id', '=', workspaceId),
      ),
      eb('mail_to', 'in', eb.selectFrom('invites').select('email').where('workspace_id', '=', workspaceId)),
    ]);
}

/**
 * GET /dev/inbox?to=&limit=, GET /dev/inbox/:id: mail caught by the local SMTP fake (admin), only
 * the mail of the admin's workspace (see forWorkspace).
 */
export function createDevInboxRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/dev/inbox', requireRole('admin'), async (req, res) => {
    const q = listQuery.parse(req.query);
    let query = db
      .selectFrom('dev_mail')
      .select(['id', 'mail_from as from', 'mail_to as to', 'subject', 'received_at as receivedAt'])
      .where(forWorkspace(req.user!.workspaceId))
      .orderBy('received_at', 'desc')
      .limit(q.limit);
    if (q.to) query = query.where('mail_to', 'like', `%${q.to.replace(/[\\%_]/g, '\\$&')}%`);
    res.json({ messages: await query.execute() });
  });

  router.get('/dev/inbox/:id', requireRole('admin'), async (req, res) => {
    const id = uuidParam(req, 'id', 'message');
    const message = await db
      .selectFrom('dev_mail')
      .select([
        'id',
        'mail_from as from',
        'mail_to as to',
        'subject',
        'text',
        'html',
        'received_at as receivedAt',
      ])
      .where('id', '=', id)
      .where(forWorkspace(req.user!.workspaceId))
      .executeTakeFirst();
    if (!message) throw new HttpError(404, 'message not found');
    res.json({ message });
  });

  return router;
}
