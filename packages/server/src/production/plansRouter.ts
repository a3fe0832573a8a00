import { applyPlan, type Design, type PlanSearchResult } from '@sigmatail/engine';
import { Router } from 'express';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { insertRevision } from '../designs/designsRepo.js';
import { HttpError } from '../http/httpError.js';
import { uuidParam } from '../http/uuidParam.js';
import { launchRun } from '../runs/launchRun.js';
import { loadPrices, loadStudyDesign } from './loadStudyDesign.js';
import { presentPlan } from './presentPlan.js';
import { findPlan, insertPlan, listPlans } from './productionRepo.js';
import { runStudy } from './runStudy.js';
import { optionalDesignQuery, planBody } from './productionSchemas.js';

/**
 * Tolerance plans: search the cheapest class assignment meeting a target (engine searchPlan),
 * save it with its frontier, and verify it with an ordinary confirming run on a new design
 * revision holding the chosen classes.
 */
export function createPlansRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/plans', requireAuth, async (req, res) => {
    const { designId } = optionalDesignQuery.parse(req.query);
    const ws = req.user!.workspaceId;
    const rows = await listPlans(db, ws, designId);
    res.json({ plans: await Promise.all(rows.map((r) => presentPlan(db, ws, r))) });
  });

  router.get('/plans/:id', requireAuth, async (req, res) => {
    const ws = req.user!.workspaceId;
    const row = await findPlan(db, ws, uuidParam(req, 'id', 'plan'));
    if (!row) throw new HttpError(404, 'plan not found');
    res.json({ plan: await presentPlan(db, ws, row) });
  });

  router.post('/plans', requireRole('engineer', 'production'), async (req, res) => {
    const body = planBody.parse(req.body ?? {});
    const user = req.user!;
    const prices = await loadPrices(db, user.workspaceId);
    const d = await loadStudyDesign(db, user.workspaceId, body.designId, body.revision);
    const targetPpm = body.targetPpm ?? Math.round((100 - body.targetYield!) * 1e4 * 1000) / 1000;
    const seed = body.seed ?? 'plan';
    const quantity = d.resolved.tube.spread.pairing?.quantity ?? 'ia';
    const result = await runStudy<PlanSearchResult>({
      kind: 'plan',
      design: d.resolved,
      options: {
        prices,
        targetPpm,
        confidence: body.confidence,
        samples: body.samples,
        seed,
        tubes: body.tubes,
        matchRule: body.matchWithin ? { quantity, within: body.matchWithin } : undefined,
      },
    });
    let confirmRevision: number | null = null;
    let confirmRunId: string | null = null;
    if (result.chosen && body.confirmSamples > 0) {
      if (d.design.archived_at)
        throw new HttpError(409, 'this design is archived; restore it to confirm a plan', 'designId');
      const doc = applyPlan(d.document as Design, result.chosen.assignment, result.matchRule);
      const classes = Object.entries(result.chosen.assignment.classes).map(([k, t]) => `${k} ${t} %`);
      confirmRevision = await insertRevision(db, {
        designId: d.design.id,
        userId: user.id,
        name: doc.name,
        document: doc,
        message: `Tolerance plan for ${targetPpm} PPM: ${classes.join(', ')}, ${result.chosen.assignment.tube} tube`,
      });
      confirmRunId = await launchRun(db, user, {
        designId: d.design.id,
        revision: confirmRevision,
        samples: body.confirmSamples,
        seed: `confirm-${seed}`,
        plan: 'random',
        analyses: { influence: false, varianceIndices: false, worstCase: false },
      });
    }
    const id = await insertPlan(db, {
      workspaceId: user.workspaceId,
      designId: d.design.id,
      revision: d.rev,
      userId: user.id,
      target: { targetPpm, confidence: body.confidence, samples: body.samples, seed },
      result,
      assignment: result.chosen?.assignment ?? null,
      confirmRevision,
      confirmRunId,
    });
    await recordAudit(db, {
      workspaceId: user.workspaceId,
      userId: user.id,
      action: 'plan.create',
      target: id,
      detail: { designId: d.design.id, revision: d.rev, targetPpm, confirmRunId },
    });
    res
      .status(201)
      .location(`/api/plans/${id}`)
      .json({ plan: await presentPlan(db, user.workspaceId, (await findPlan(db, user.workspaceId, id))!) });
  });

  return router;
}
