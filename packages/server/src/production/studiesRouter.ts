import { DEFAULT_AGEING_SCENARIO, type AgeingResult, type PairingComparison } from '@sigmatail/engine';
import { Router, type Request } from 'express';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { HttpError } from '../http/httpError.js';
import { loadPrices, loadStudyDesign, loadTubeLot } from './loadStudyDesign.js';
import { runStudy } from './runStudy.js';
import { insertStudy, latestStudy } from './productionRepo.js';
import { ageingBody, designQuery, pairingBody } from './productionSchemas.js';

/** Pairing comparisons and ageing results: computed on request, saved, latest per design readable. */
export function createStudiesRouter({ db }: AppDeps): Router {
  const router = Router();

  const save = async (
    req: Request,
    kind: 'pairing' | 'ageing',
    designId: string,
    revision: number,
    input: unknown,
    result: unknown,
  ) => {
    const { workspaceId, id: userId } = req.user!;
    const id = await insertStudy(db, { workspaceId, designId, revision, userId, kind, input, result });
    await recordAudit(db, {
      workspaceId,
      userId,
      action: `${kind}.create`,
      target: id,
      detail: { designId, revision },
    });
    return (await latestStudy(db, workspaceId, designId, kind))!;
  };
  const latest = (kind: 'pairing' | 'ageing') => async (req: Request, res: import('express').Response) => {
    const { designId } = designQuery.parse(req.query);
    const study = await latestStudy(db, req.user!.workspaceId, designId, kind);
    if (!study) throw new HttpError(404, `no saved ${kind} result for this design`, 'designId');
    res.json({ study });
  };

  router.post('/pairing', requireRole('engineer', 'production'), async (req, res) => {
    const body = pairingBody.parse(req.body ?? {});
    const prices = await loadPrices(db, req.user!.workspaceId);
    const d = await loadStudyDesign(db, req.user!.workspaceId, body.designId, body.revision);
    const lot = body.lotId ? await loadTubeLot(db, req.user!.workspaceId, body.lotId, d.resolved) : body.lot;
    const result = await runStudy<PairingComparison>({
      kind: 'pairing',
      design: d.resolved,
      prices,
      rules: body.strategies,
      options: { samples: body.samples, seed: body.seed, lot },
    });
    res.status(201).json({
      study: await save(req, 'pairing', d.design.id, d.rev, body, { ...result, currency: prices.currency }),
    });
  });
  router.get('/pairing/latest', requireAuth, latest('pairing'));

  router.post('/ageing', requireRole('engineer', 'production'), async (req, res) => {
    const body = ageingBody.parse(req.body ?? {});
    const d = await loadStudyDesign(db, req.user!.workspaceId, body.designId, body.revision);
    const scenario = body.scenario ?? DEFAULT_AGEING_SCENARIO;
    const result = await runStudy<AgeingResult>({
      kind: 'ageing',
      design: d.resolved,
      scenario,
      options: { samples: body.samples, seed: body.seed },
    });
    res
      .status(201)
      .json({ study: await save(req, 'ageing', d.design.id, d.rev, { ...body, scenario }, result) });
  });
  router.get('/ageing/latest', requireAuth, latest('ageing'));

  return router;
}
