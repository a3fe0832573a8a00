import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { requireRole } from '../auth/requireRole.js';

const listQuery = z.object({
  action: z.string().max(100).optional(),
  before: z.iso.datetime({ offset: true, message: 'must be an ISO date-time' }).optional(),
  limit: z.coerce.number().int('must be a whole number').min(1).max(500).default(100),
});

/** GET /audit?action=&before=&limit=: the workspace's audit trail, newest first (admin). */
export function createAuditRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/audit', requireRole('admin'), async (req, res) => {
    const q = listQuery.parse(req.query);
    let query = db
      .selectFrom('audit_events as a')
      .leftJoin('users as u', 'u.id', 'a.user_id')
      .select([
        'a.id',
        'a.action',
        'a.target',
        'a.detail',
        'a.at',
        'u.id as userId',
        'u.name as userName',
        'u.email as userEmail',
      ])
      .where('a.workspace_id', '=', req.user!.workspaceId)
      .orderBy('a.at', 'desc')
      .limit(q.limit);
    if (q.action) query = query.where('a.action', '=', q.action);
    if (q.before) query = query.where('a.at', '<', new Date(q.before));
    const rows = await query.execute();
    res.json({
      events: rows.map(({ userId, userName, userEmail, ...e }) => ({
        ...e,
        user: userId ? { id: userId, name: userName, email: userEmail } : null,
      })),
    });
  });

  return router;
}
