import { Router } from 'express';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { findPrices, upsertPrices } from './productionRepo.js';
import { priceTableBody } from './productionSchemas.js';

/** The workspace price table: anyone signed in reads it; engineers, production leads and admins set it. */
export function createPricesRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/prices', requireAuth, async (req, res) => {
    const row = await findPrices(db, req.user!.workspaceId);
    res.json({ prices: row?.prices ?? null, updatedAt: row?.updated_at ?? null });
  });

  router.put('/prices', requireRole('engineer', 'production'), async (req, res) => {
    const prices = priceTableBody.parse(req.body ?? {});
    const { workspaceId, id } = req.user!;
    await upsertPrices(db, workspaceId, id, prices);
    await recordAudit(db, {
      workspaceId,
      userId: id,
      action: 'prices.update',
      target: workspaceId,
      detail: { rows: prices.resistors.length },
    });
    const row = await findPrices(db, workspaceId);
    res.json({ prices: row!.prices, updatedAt: row!.updated_at });
  });

  return router;
}
