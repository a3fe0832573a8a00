import { LOT_KINDS, TUBE_CATALOG, TUBE_LOT_QUANTITIES, TUBE_TYPES } from '@sigmatail/engine';
import { Router, type Request } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../appDeps.js';
import { recordAudit } from '../audit/recordAudit.js';
import { requireAuth, requireRole } from '../auth/requireRole.js';
import { findDesign, findRevision, insertRevision } from '../designs/designsRepo.js';
import { validateDesignDocument } from '../designs/validateDesignDocument.js';
import { nameField } from '../http/fields.js';
import { HttpError } from '../http/httpError.js';
import { isUuid, uuidParam } from '../http/uuidParam.js';
import { applyLotToDocument, LOT_TARGETS } from './applyLotToDocument.js';
import { lotUpload } from './lotUpload.js';
import { deleteLot, findLot, insertLot, listLots } from './lotsRepo.js';
import { parseLotCsv, type LotFileSpec } from './parseLotCsv.js';
import { presentLot } from './presentLot.js';

const volts = z.coerce
  .number({ message: 'must be a number of volts' })
  .refine(Number.isFinite, 'must be finite');
export const uploadFields = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('resistor'), name: nameField }),
  z.object({
    kind: z.literal('tube'),
    name: nameField,
    quantity: z.enum(TUBE_LOT_QUANTITIES, { message: `must be ${TUBE_LOT_QUANTITIES.join(' or ')}` }),
    tubeType: z.enum(TUBE_TYPES, { message: `must be one of ${TUBE_TYPES.join(', ')}` }),
    va: z.preprocess(emptyToUndefined, volts.pipe(z.number().positive('must be above 0 V')).optional()),
    vg: z.preprocess(emptyToUndefined, volts.pipe(z.number().max(0, 'must be 0 V or below')).optional()),
  }),
]);
const kindField = z.object({
  kind: z.enum(LOT_KINDS, { message: `must be ${LOT_KINDS.join(' or ')}` }),
});
export const applyBody = z.object({
  designId: z.string().refine(isUuid, 'must be a design id'),
  target: z.enum(LOT_TARGETS, { message: `must be a part name (${LOT_TARGETS.join(', ')})` }),
  message: z.string().trim().max(500, 'must be at most 500 characters').optional(),
});

function emptyToUndefined(v: unknown): unknown {
  return v === '' ? undefined : v;
}

/**
 * Lots API: list, upload (multipart CSV, one transaction, row errors), read with statistics,
 * delete, and apply to a design (a new revision with the lot's values embedded).
 */
export function createLotsRouter({ db }: AppDeps): Router {
  const router = Router();
  const loadLot = async (req: Request) => {
    const lot = await findLot(db, req.user!.workspaceId, uuidParam(req, 'id', 'lot'));
    if (!lot) throw new HttpError(404, 'lot not found');
    return lot;
  };

  router.get('/lots', requireAuth, async (req, res) => {
    res.json({ lots: await listLots(db, req.user!.workspaceId) });
  });

  router.post('/lots', requireRole('engineer', 'production'), lotUpload, async (req, res) => {
    kindField.parse(req.body ?? {});
    const f = uploadFields.parse(req.body);
    let spec: LotFileSpec = { kind: 'resistor' };
    if (f.kind === 'tube') {
      const typical = TUBE_CATALOG[f.tubeType].typical;
      spec = {
        kind: 'tube',
        quantity: f.quantity,
        tubeType: f.tubeType,
        testPoint: { va: f.va ?? typical.va, vg: f.vg ?? typical.vg },
      };
    }
    const parsed = parseLotCsv(req.file!.buffer, spec);
    if (!parsed.ok) {
      throw new HttpError(
        400,
        `file: ${parsed.message}`,
        'file',
        parsed.errors.map((e) => ({ path: `rows.${e.row}.${e.column}`, message: e.message })),
      );
    }
    const id = await insertLot(db, {
      workspace_id: req.user!.workspaceId,
      name: f.name,
      kind: f.kind,
      quantity: spec.kind === 'tube' ? spec.quantity : 'ohms',
      tube_type: spec.kind === 'tube' ? spec.tubeType : null,
      test_point: spec.kind === 'tube' ? spec.testPoint : null,
      file_name: req.file!.originalname.slice(0, 200),
      count: parsed.count,
      data: parsed.data,
      created_by: req.user!.id,
    });
    res.status(201).json({ lot: presentLot((await findLot(db, req.user!.workspaceId, id))!) });
  });

  router.get('/lots/:id', requireAuth, async (req, res) => {
    res.json({ lot: presentLot(await loadLot(req)) });
  });

  router.delete('/lots/:id', requireRole('engineer', 'production'), async (req, res) => {
    const id = uuidParam(req, 'id', 'lot');
    if (!(await deleteLot(db, req.user!.workspaceId, id, req.user!.id)))
      throw new HttpError(404, 'lot not found');
    res.status(204).end();
  });

  router.post('/lots/:id/apply', requireRole('engineer', 'production'), async (req, res) => {
    const lot = await loadLot(req);
    const body = applyBody.parse(req.body ?? {});
    const design = await findDesign(db, req.user!.workspaceId, body.designId);
    if (!design) throw new HttpError(404, 'design not found', 'designId');
    if (design.archived_at)
      throw new HttpError(409, 'this design is archived; restore it before saving a revision');
    const latest = (await findRevision(db, design.id, design.latest_rev))!;
    const { document, warnings } = applyLotToDocument(latest.document, lot, body.target);
    const valid = validateDesignDocument(document);
    const rev = await insertRevision(db, {
      designId: design.id,
      userId: req.user!.id,
      name: valid.name,
      document,
      message: body.message ?? `Lot "${lot.name}" applied to ${body.target}`,
    });
    const who = { workspaceId: req.user!.workspaceId, userId: req.user!.id };
    await recordAudit(db, {
      ...who,
      action: 'lot.apply',
      target: lot.id,
      detail: { designId: design.id, rev, target: body.target },
    });
    // The design's own trail shows the revision too, as a save through the designs API would.
    await recordAudit(db, {
      ...who,
      action: 'design.revise',
      target: design.id,
      detail: { rev, lot: lot.id },
    });
    res.status(201).json({ designId: design.id, rev, warnings });
  });

  return router;
}
