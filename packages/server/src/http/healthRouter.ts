import { sql } from 'kysely';
import { Router } from 'express';
import type { AppDeps } from '../appDeps.js';

/** GET /api/health: 200 when the database answers, 503 otherwise. Public. */
export function createHealthRouter({ db }: AppDeps): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    try {
      await sql`select 1`.execute(db);
      res.json({ ok: true, db: 'up' });
    } catch {
      res.status(503).json({ ok: false, db: 'down' });
    }
  });
  return router;
}
