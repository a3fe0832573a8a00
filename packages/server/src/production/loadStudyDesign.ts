import type { Database, TubeLotData } from '@sigmatail/db';
import { parseDesign, type PriceTable, type ResolvedDesign, type TubeLot } from '@sigmatail/engine';
import type { Kysely } from 'kysely';
import { HttpError } from '../http/httpError.js';
import { findLot } from '../lots/lotsRepo.js';
import { findDesignRevision, findPrices } from './productionRepo.js';

/**
 * The design revision a study runs on (404 naming designId or revision when the workspace has
 * none), parsed and resolved.
 */
export async function loadStudyDesign(
  db: Kysely<Database>,
  workspaceId: string,
  designId: string,
  revision?: number,
) {
  const found = await findDesignRevision(db, workspaceId, designId, revision);
  if (!found) {
    const anyRev = await findDesignRevision(db, workspaceId, designId, 1);
    throw anyRev
      ? new HttpError(404, `design has no revision ${revision}`, 'revision')
      : new HttpError(404, 'design not found', 'designId');
  }
  const parsed = parseDesign(found.document);
  if (!parsed.ok) throw new HttpError(422, `revision ${found.rev} is not a valid design`, 'revision');
  return { ...found, resolved: parsed.design as ResolvedDesign };
}

/** The workspace's price table, or 409 naming `prices` when none is set yet. */
export async function loadPrices(db: Kysely<Database>, workspaceId: string): Promise<PriceTable> {
  const row = await findPrices(db, workspaceId);
  if (!row) throw new HttpError(409, 'this workspace has no price table yet; set one first', 'prices');
  return row.prices as PriceTable;
}

/**
 * A stored tube lot of the workspace as the studies draw it: whole envelopes, both sections' spread
 * multipliers as the upload converted them. 404 naming lotId when the workspace has no such lot,
 * 400 when it is a resistor lot or measures another tube type than the design's.
 */
export async function loadTubeLot(
  db: Kysely<Database>,
  workspaceId: string,
  lotId: string,
  design: ResolvedDesign,
): Promise<TubeLot> {
  const lot = await findLot(db, workspaceId, lotId);
  if (!lot) throw new HttpError(404, 'lot not found', 'lotId');
  if (lot.kind !== 'tube')
    throw new HttpError(400, `lotId: ${lot.name} is a resistor lot, not a tube lot`, 'lotId');
  if (lot.tubeType !== design.tube.type) {
    throw new HttpError(
      400,
      `lotId: ${lot.name} holds ${lot.tubeType} tubes; the design uses ${design.tube.type}`,
      'lotId',
    );
  }
  return { quantity: 'multipliers', tubes: (lot.data as TubeLotData).multipliers };
}
