import type { Database, LotsTable, ResistorLotData, TubeLotData } from '@sigmatail/db';
import type { Insertable, Kysely } from 'kysely';
import { recordAudit } from '../audit/recordAudit.js';

/** All lot SQL. Every query is scoped by workspace: another workspace's id finds nothing. */

const LIST_COLUMNS = [
  'l.id',
  'l.name',
  'l.kind',
  'l.quantity',
  'l.tube_type as tubeType',
  'l.test_point as testPoint',
  'l.file_name as fileName',
  'l.count',
  'l.created_at as createdAt',
  'u.name as createdByName',
] as const;

export async function listLots(db: Kysely<Database>, workspaceId: string) {
  return db
    .selectFrom('lots as l')
    .innerJoin('users as u', 'u.id', 'l.created_by')
    .select(LIST_COLUMNS)
    .where('l.workspace_id', '=', workspaceId)
    .orderBy('l.created_at', 'desc')
    .limit(500)
    .execute();
}

export async function findLot(db: Kysely<Database>, workspaceId: string, id: string) {
  return db
    .selectFrom('lots as l')
    .innerJoin('users as u', 'u.id', 'l.created_by')
    .select([...LIST_COLUMNS, 'l.data'])
    .where('l.workspace_id', '=', workspaceId)
    .where('l.id', '=', id)
    .executeTakeFirst();
}

export type LotRow = NonNullable<Awaited<ReturnType<typeof findLot>>>;

/** Stores a lot and its audit event in one transaction: both or neither. */
export async function insertLot(
  db: Kysely<Database>,
  v: Omit<Insertable<LotsTable>, 'data' | 'test_point'> & {
    data: ResistorLotData | TubeLotData;
    test_point: { va: number; vg: number } | null;
  },
): Promise<string> {
  return db.transaction().execute(async (tx) => {
    const row = await tx
      .insertInto('lots')
      .values({
        ...v,
        data: JSON.stringify(v.data),
        test_point: v.test_point ? JSON.stringify(v.test_point) : null,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await recordAudit(tx, {
      workspaceId: v.workspace_id,
      userId: v.created_by,
      action: 'lot.upload',
      target: row.id,
      detail: { name: v.name, kind: v.kind, count: v.count },
    });
    return row.id;
  });
}

/** Deletes a lot (designs keep their embedded copies of its values). True when a row went. */
export async function deleteLot(db: Kysely<Database>, workspaceId: string, id: string, userId: string) {
  return db.transaction().execute(async (tx) => {
    const gone = await tx
      .deleteFrom('lots')
      .where('workspace_id', '=', workspaceId)
      .where('id', '=', id)
      .returning('name')
      .executeTakeFirst();
    if (gone) {
      await recordAudit(tx, {
        workspaceId,
        userId,
        action: 'lot.delete',
        target: id,
        detail: { name: gone.name },
      });
    }
    return Boolean(gone);
  });
}
