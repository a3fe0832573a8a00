import { METRIC_IDS, suggestGuardBand, testLimitRates, type MetricSummary } from '@sigmatail/engine';
import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { requireAuth } from '../auth/requireRole.js';
import { HttpError } from '../http/httpError.js';
import { isUuid } from '../http/uuidParam.js';
import { recordAudit } from '../audit/recordAudit.js';
import { insertStudy } from '../production/productionRepo.js';
import { findResultsText, findRun } from '../runs/runsRepo.js';

const SAVERS: readonly string[] = ['admin', 'engineer', 'production'];

const finite = (what: string) =>
  z.number({ message: `must be a number${what}` }).refine(Number.isFinite, 'must be a finite number');
const limits = z
  .object({ low: finite('').optional(), high: finite('').optional() })
  .refine((l) => l.low !== undefined || l.high !== undefined, { message: 'needs low or high', path: ['low'] })
  .refine((l) => l.low === undefined || l.high === undefined || l.low < l.high, {
    message: 'must be above low',
    path: ['high'],
  });
export const testLimitsBody = z.object({
  process: z.union([
    z.object({ mean: finite(''), sd: finite('').pipe(z.number().positive('must be positive')) }),
    z.object({
      runId: z.string().refine(isUuid, 'must be a run id'),
      metric: z.enum(METRIC_IDS, { message: 'must be a metric of the run' }),
    }),
  ]),
  measurementSd: finite('').pipe(z.number().min(0, 'must be zero or positive')),
  spec: limits,
  test: limits.optional(),
  /** Target false-accept rate, PPM of parts tested. */
  targetFalseAcceptPpm: finite('')
    .pipe(z.number().gt(0, 'must be above 0 PPM').lt(1e6, 'must be below 1 000 000 PPM'))
    .optional(),
  /** Keep these limits as the chosen ones of the run's design (its production report shows them). */
  save: z.boolean({ message: 'must be true or false' }).optional(),
});

/**
 * POST /test-limits: false-accept and false-reject rates of chosen test limits and a suggested
 * guard band, for a normal process (given, or a stored run's metric mean and sd) and normal
 * measurement error. With `save` (engineer, production; process from a run) the answer is kept as
 * the chosen test limits of the run's design, which its production report shows.
 */
export function createTestLimitsRouter({ db }: AppDeps): Router {
  const router = Router();
  router.post('/test-limits', requireAuth, async (req, res) => {
    const b = testLimitsBody.parse(req.body ?? {});
    if (b.save && !SAVERS.includes(req.user!.role)) {
      throw new HttpError(
        403,
        `your role (${req.user!.role}) may compute test limits but not save them`,
        'save',
      );
    }
    if (b.save && !('runId' in b.process)) {
      throw new HttpError(
        400,
        'save: test limits are saved for a run’s design; take the process from a run',
        'save',
      );
    }
    let design: { id: string; revision: number } | undefined;
    let process: { mean: number; sd: number; runId?: string; metric?: string };
    if ('runId' in b.process) {
      const run = await findRun(db, req.user!.workspaceId, b.process.runId);
      if (!run) throw new HttpError(404, 'run not found', 'process.runId');
      const text = await findResultsText(db, run.id);
      if (!text) throw new HttpError(409, 'process.runId: this run has no results yet', 'process.runId');
      const m = (JSON.parse(text) as { metrics: Record<string, MetricSummary> }).metrics[b.process.metric];
      if (!m || m.mean === null || !(m.sd !== null && m.sd > 0)) {
        throw new HttpError(400, 'process.metric: the run has no spread of this metric', 'process.metric');
      }
      process = { mean: m.mean, sd: m.sd, runId: run.id, metric: b.process.metric };
      design = { id: run.designId, revision: run.revision };
    } else process = b.process;
    const input = {
      process: { mean: process.mean, sd: process.sd },
      measurementSd: b.measurementSd,
      spec: b.spec,
    };
    const test = b.test ?? b.spec;
    const rates = testLimitRates({ ...input, test });
    const suggestion =
      b.targetFalseAcceptPpm !== undefined && b.measurementSd > 0
        ? suggestGuardBand(input, b.targetFalseAcceptPpm / 1e6)
        : null;
    const answer = { process, spec: b.spec, test, measurementSd: b.measurementSd, rates, suggestion };
    let saved: { id: string } | null = null;
    if (b.save && design) {
      const { workspaceId, id: userId } = req.user!;
      const id = await insertStudy(db, {
        workspaceId,
        designId: design.id,
        revision: design.revision,
        userId,
        kind: 'limits',
        input: b,
        result: answer,
      });
      await recordAudit(db, {
        workspaceId,
        userId,
        action: 'limits.create',
        target: id,
        detail: { designId: design.id },
      });
      saved = { id };
    }
    res.json({ ...answer, saved });
  });
  return router;
}
