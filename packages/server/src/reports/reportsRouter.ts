import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { HttpError } from '../http/httpError.js';
import { uuidParam } from '../http/uuidParam.js';
import { buildProductionReport } from './productionReport.js';
import { renderReportMail } from './renderReportMail.js';

/** POST /api/reports/:designId/email body. */
export const emailReportBody = z.strictObject({
  to: z.email({ message: 'must be an e-mail address' }).max(254, 'must be at most 254 characters'),
  note: z.string().trim().max(2000, 'must be at most 2000 characters').optional(),
});

/** The production report of a design: read it (any role) or mail it to a colleague (engineer, production). */
export function createReportsRouter({ db, mailer, config }: AppDeps): Router {
  const router = Router();

  router.get('/reports/:designId', requireAuth, async (req, res) => {
    const designId = uuidParam(req, 'designId', 'design');
    res.json({ report: await buildProductionReport(db, req.user!.workspaceId, designId) });
  });

  router.post('/reports/:designId/email', requireRole('engineer', 'production'), async (req, res) => {
    const designId = uuidParam(req, 'designId', 'design');
    const { to, note } = emailReportBody.parse(req.body ?? {});
    const user = req.user!;
    const report = await buildProductionReport(db, user.workspaceId, designId);
    const link = `${config.appUrl}/production/report/${designId}`;
    try {
      await mailer.send({ to, ...renderReportMail(report, { link, senderName: user.name, note }) });
    } catch (err) {
      throw new HttpError(502, `the report mail could not be sent: ${(err as Error).message}`);
    }
    await recordAudit(db, {
      workspaceId: user.workspaceId,
      userId: user.id,
      action: 'report.email',
      target: designId,
      detail: { to, runId: report.run?.id ?? null },
    });
    res.json({ sent: true, to });
  });

  return router;
}
