import type { Database } from '@sigmatail/db';
import { parseDesign, type PriceTable, type ResolvedDesign } from '@sigmatail/engine';
import type { Kysely } from 'kysely';
import { HttpError } from '../http/httpError.js';
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
