import { Router, type Request } from 'express';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { HttpError } from '../http/httpError.js';
import { uuidParam } from '../http/uuidParam.js';
import { notifyRuns } from '../worker/runsChannel.js';
import { launchRun } from './launchRun.js';
import { buildOpenApi } from './openApi/buildOpenApi.js';
import { runSampleSource } from './runSampleSource.js';
import { launchRunBody, listRunsQuery, samplesQuery, type RunView } from './runSchemas.js';
import { cancelRun, findResultsText, findRun, findRunWithWorkspace, listRuns } from './runsRepo.js';
import { createExportPool } from './exportPool.js';
import { RunViewCache } from './runViewCache.js';
import { sampleRowsHead } from './sampleRowsHead.js';
import { streamSamplesCsv } from './streamSamplesCsv.js';

const LAUNCHERS = ['engineer', 'production'] as const; // and admin, who passes every check

/** Runs API: launch, status and progress, list, cancel, results, exports (mounted under /api). */
export function createRunsRouter({ db }: AppDeps): Router {
  const router = Router();
  const exports = createExportPool();
  const loadRun = async (req: Request): Promise<RunView> => {
    const run = await findRun(db, req.user!.workspaceId, uuidParam(req, 'id', 'run'));
    if (!run) throw new HttpError(404, 'run not found');
    return run;
  };
  const loadDone = async (req: Request): Promise<RunView> => {
    const run = await loadRun(req);
    if (run.status !== 'done')
      throw new HttpError(409, `run is ${run.status}; results exist once it is done`);
    return run;
  };
  const audit = (req: Request, action: string, runId: string, detail: Record<string, unknown> = {}) =>
    recordAudit(db, {
      workspaceId: req.user!.workspaceId,
      userId: req.user!.id,
      action,
      target: runId,
      detail,
    });

  router.post('/runs', requireRole(...LAUNCHERS), async (req, res) => {
    const id = await launchRun(db, req.user!, launchRunBody.parse(req.body));
    res.status(202).location(`/api/runs/${id}`).json({ id });
  });

  router.get('/runs', requireAuth, async (req, res) => {
    // An empty filter (?status=) means no filter, as HTML forms send it.
    const query = Object.fromEntries(Object.entries(req.query).filter(([, v]) => v !== ''));
    res.json({ runs: await listRuns(db, req.user!.workspaceId, listRunsQuery.parse(query)) });
  });

  // Status polling is the hot read (every open run page polls it): served from a 250 ms cache.
  const views = new RunViewCache();
  router.get('/runs/:id', requireAuth, async (req, res) => {
    const id = uuidParam(req, 'id', 'run');
    const run = await views.get(req.user!.workspaceId, id, () => findRunWithWorkspace(db, id));
    if (!run) throw new HttpError(404, 'run not found');
    res.json({ run });
  });

  router.post('/runs/:id/cancel', requireRole(...LAUNCHERS), async (req, res) => {
    const run = await loadRun(req);
    if (!(await cancelRun(db, req.user!.workspaceId, run.id))) {
      throw new HttpError(409, `run is already ${run.status}`);
    }
    views.forget(run.id);
    await notifyRuns(db, 'changed', run.id);
    await audit(req, 'run.cancel', run.id, { status: run.status, progress: run.progress });
    res.json({ run: await loadRun(req) });
  });

  router.get('/runs/:id/results', requireAuth, async (req, res) => {
    const run = await loadDone(req);
    const text = await findResultsText(db, run.id);
    res.type('application/json').send(`{"run":${JSON.stringify(run)},"results":${text}}`);
  });

  router.get('/runs/:id/export.json', requireRole(...LAUNCHERS), async (req, res) => {
    const run = await loadDone(req);
    const text = await findResultsText(db, run.id);
    await audit(req, 'run.export', run.id, { format: 'json' });
    res.attachment(`sigmatail-run-${run.id}.json`);
    res.type('application/json').send(`{"run":${JSON.stringify(run)},"results":${text}}`);
  });

  router.get('/runs/:id/export.csv', requireRole(...LAUNCHERS), async (req, res) => {
    const run = await loadDone(req);
    const { design, plan } = await runSampleSource(db, run);
    await audit(req, 'run.export', run.id, { format: 'csv', samples: run.samples });
    res.attachment(`sigmatail-run-${run.id}-samples.csv`);
    res.type('text/csv');
    try {
      await streamSamplesCsv(res, design, plan, exports.slice);
    } catch (err) {
      if (!res.headersSent) throw err;
      console.error(`export of run ${run.id} broke off: ${(err as Error).message}`);
      res.destroy();
      return;
    }
    res.end();
  });

  // A scatter preview: the first samples as JSON, for every role that may read the run; unlike
  // the export it is bounded in size and is not an audited export.
  router.get('/runs/:id/samples', requireAuth, async (req, res) => {
    const { limit } = samplesQuery.parse(req.query);
    const run = await loadDone(req);
    const { design, plan } = await runSampleSource(db, run);
    res.json(sampleRowsHead(design, plan, limit));
  });

  // The API description, built from the same route tables and zod schemas the app enforces, so it
  // cannot drift; packages/server/openapi.json is a snapshot of it (openApi/writeOpenApi.ts).
  let openApi: Promise<Record<string, unknown>> | undefined;
  router.get('/openapi.json', async (_req, res) => {
    openApi ??= buildOpenApi();
    res.json(await openApi);
  });

  return router;
}
