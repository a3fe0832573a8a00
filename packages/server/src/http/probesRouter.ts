import { pendingMigrations } from '@sigmatail/db';
import { Router } from 'express';
import { sql } from 'kysely';
import type { AppDeps } from '../appDeps.js';

const startedAt = Date.now();

/**
 * GET /healthz: the process is up (200 always; for a supervisor's liveness check).
 * GET /readyz: ready for traffic: the database answers and every migration is applied (200), else
 * 503 with the reason (for a load balancer's readiness check). Both outside /api, no session.
 */
export function createProbesRouter({ db }: AppDeps): Router {
  const router = Router();
  router.get('/healthz', (_req, res) => {
    res.json({ ok: true, uptimeSeconds: Math.round((Date.now() - startedAt) / 1000) });
  });
  router.get('/readyz', async (_req, res) => {
    try {
      await sql`select 1`.execute(db);
    } catch (err) {
      res.status(503).json({
        ok: false,
        db: 'down',
        error: { message: `the database is unreachable: ${(err as Error).message}` },
      });
      return;
    }
    const pending = await pendingMigrations(db);
    if (pending.length) {
      res.status(503).json({
        ok: false,
        db: 'up',
        migrations: { pending },
        error: { message: `the database schema is not current: ${pending.length} migration(s) pending` },
      });
      return;
    }
    res.json({ ok: true, db: 'up', migrations: { pending: [] } });
  });
  return router;
}
