import { Router, type Request } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { HttpError } from '../http/httpError.js';
import { uuidParam } from '../http/uuidParam.js';
import {
  findDesign,
  findRevision,
  insertDesign,
  insertRevision,
  listDesigns,
  listRevisions,
  setArchived,
} from './designsRepo.js';
import { validateDesignDocument } from './validateDesignDocument.js';

const listQuery = z.object({
  q: z.string().trim().max(200, 'must be at most 200 characters').optional(),
  archived: z
    .enum(['exclude', 'include', 'only'], { message: 'must be exclude, include or only' })
    .default('exclude'),
});
export const saveBody = z.object({
  document: z.unknown(),
  message: z.string().trim().max(500, 'must be at most 500 characters').optional(),
});
export const archiveBody = z.object({ archived: z.boolean().default(true) }).default({ archived: true });
const revParam = z.coerce.number().int().min(1).max(2_147_483_647);

/** Designs API: list/search, create, read, revisions (each save is a new immutable revision), archive. */
export function createDesignsRouter({ db }: AppDeps): Router {
  const router = Router();

  const loadDesign = async (req: Request) => {
    const d = await findDesign(db, req.user!.workspaceId, uuidParam(req, 'id', 'design'));
    if (!d) throw new HttpError(404, 'design not found');
    return d;
  };
  /** The saved document (validated, or a 400 naming the field), its name and message, and who saves it. */
  const readSave = (req: Request) => {
    const body = saveBody.parse(req.body ?? {});
    const design = validateDesignDocument(body.document);
    return {
      userId: req.user!.id,
      name: design.name,
      document: body.document,
      message: body.message ?? null,
    };
  };
  /** One audit event by the signed-in user in their workspace. */
  const audit = (req: Request, action: string, target: string, detail?: Record<string, unknown>) =>
    recordAudit(db, { workspaceId: req.user!.workspaceId, userId: req.user!.id, action, target, detail });
  const present = async (designId: string, workspaceId: string) => {
    const d = (await findDesign(db, workspaceId, designId))!;
    const latest = await findRevision(db, d.id, d.latest_rev);
    return {
      design: {
        id: d.id,
        name: d.name,
        latestRev: d.latest_rev,
        createdAt: d.created_at,
        updatedAt: d.updated_at,
        archivedAt: d.archived_at,
        latestRevision: latest,
      },
    };
  };

  router.get('/designs', requireAuth, async (req, res) => {
    const q = listQuery.parse(req.query);
    res.json({ designs: await listDesigns(db, req.user!.workspaceId, q) });
  });

  router.post('/designs', requireRole('engineer'), async (req, res) => {
    const save = readSave(req);
    const workspaceId = req.user!.workspaceId;
    const id = await insertDesign(db, { workspaceId, ...save });
    await audit(req, 'design.create', id, { name: save.name });
    res.status(201).json(await present(id, workspaceId));
  });

  router.get('/designs/:id', requireAuth, async (req, res) => {
    const d = await loadDesign(req);
    res.json(await present(d.id, d.workspace_id));
  });

  router.get('/designs/:id/revisions', requireAuth, async (req, res) => {
    const d = await loadDesign(req);
    res.json({ revisions: await listRevisions(db, d.id) });
  });

  router.get('/designs/:id/revisions/:rev', requireAuth, async (req, res) => {
    const d = await loadDesign(req);
    const rev = revParam.safeParse(req.params.rev);
    const revision = rev.success ? await findRevision(db, d.id, rev.data) : undefined;
    if (!revision) throw new HttpError(404, 'revision not found');
    res.json({ revision });
  });

  router.post('/designs/:id/revisions', requireRole('engineer'), async (req, res) => {
    const d = await loadDesign(req);
    if (d.archived_at)
      throw new HttpError(409, 'this design is archived; restore it before saving a revision');
    const rev = await insertRevision(db, { designId: d.id, ...readSave(req) });
    await audit(req, 'design.revise', d.id, { rev });
    res.status(201).json({ revision: await findRevision(db, d.id, rev) });
  });

  // Body {archived: false} restores an archived design.
  router.post('/designs/:id/archive', requireRole('engineer'), async (req, res) => {
    const d = await loadDesign(req);
    const { archived } = archiveBody.parse(req.body ?? undefined);
    await setArchived(db, d.id, archived);
    await audit(req, archived ? 'design.archive' : 'design.restore', d.id);
    res.json(await present(d.id, d.workspace_id));
  });

  return router;
}
