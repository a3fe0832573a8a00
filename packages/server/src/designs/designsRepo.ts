import type { Database } from '@sigmatail/db';
import { sql, type Kysely, type Transaction } from 'kysely';

/** All design SQL: a design is a name plus a chain of immutable revisions 1, 2, 3, … */

export async function listDesigns(
  db: Kysely<Database>,
  workspaceId: string,
  filter: { q?: string; archived: 'exclude' | 'include' | 'only' },
) {
  let query = db
    .selectFrom('designs as d')
    .innerJoin('users as u', 'u.id', 'd.created_by')
    .select([
      'd.id',
      'd.name',
      'd.latest_rev as latestRev',
      'd.created_at as createdAt',
      'd.updated_at as updatedAt',
      'd.archived_at as archivedAt',
      'u.id as createdById',
      'u.name as createdByName',
      // What a card in the list says at a glance: the latest revision's topology, tube and B+ …
      (eb) =>
        eb
          .selectFrom('design_revisions as lr')
          .select(
            sql<{ topology: string | null; tube: string | null; bPlus: number | null }>`json_build_object(
              'topology', lr.document->>'topology',
              'tube', lr.document#>>'{tube,type}',
              'bPlus', case when jsonb_typeof(lr.document#>'{supply,bPlus}') = 'number'
                then (lr.document#>>'{supply,bPlus}')::float8 end)`.as('glance'),
          )
          .whereRef('lr.design_id', '=', 'd.id')
          .whereRef('lr.rev', '=', 'd.latest_rev')
          .as('glance'),
      // … and the joint yield of its latest finished run (any revision).
      (eb) =>
        eb
          .selectFrom('runs as r')
          .innerJoin('run_results as rr', 'rr.run_id', 'r.id')
          .select(
            sql<{
              id: string;
              revision: number;
              samples: number;
              jointYield: number;
              finishedAt: string;
            }>`json_build_object('id', r.id, 'revision', r.revision, 'samples', r.samples,
              'jointYield', rr.joint_yield, 'finishedAt', r.finished_at)`.as('latest'),
          )
          .whereRef('r.design_id', '=', 'd.id')
          .where('r.status', '=', 'done')
          .orderBy('r.finished_at', 'desc')
          .limit(1)
          .as('latestRun'),
    ])
    .where('d.workspace_id', '=', workspaceId)
    .orderBy('d.updated_at', 'desc')
    .limit(500);
  if (filter.archived === 'exclude') query = query.where('d.archived_at', 'is', null);
  if (filter.archived === 'only') query = query.where('d.archived_at', 'is not', null);
  if (filter.q) {
    const like = `%${filter.q.replace(/[\\%_]/g, '\\$&')}%`;
    query = query.where((eb) =>
      eb.or([
        eb('d.name', 'ilike', like),
        // Notes and tube type live in the latest document ("the one with the 12AT7").
        eb.exists(
          eb
            .selectFrom('design_revisions as r')
            .select(sql`1`.as('one'))
            .whereRef('r.design_id', '=', 'd.id')
            .whereRef('r.rev', '=', 'd.latest_rev')
            .where((w) =>
              w.or([
                w(sql<string>`coalesce(r.document->>'notes', '')`, 'ilike', like),
                w(sql<string>`coalesce(r.document#>>'{tube,type}', '')`, 'ilike', like),
              ]),
            ),
        ),
      ]),
    );
  }
  const rows = await query.execute();
  return rows.map(({ createdById, createdByName, glance, latestRun, ...d }) => ({
    ...d,
    topology: glance?.topology ?? null,
    tube: glance?.tube ?? null,
    bPlus: glance?.bPlus ?? null,
    latestRun: latestRun ? { ...latestRun, finishedAt: new Date(latestRun.finishedAt).toISOString() } : null,
    createdBy: { id: createdById, name: createdByName },
  }));
}

export async function findDesign(db: Kysely<Database>, workspaceId: string, id: string) {
  return db
    .selectFrom('designs')
    .selectAll()
    .where('workspace_id', '=', workspaceId)
    .where('id', '=', id)
    .executeTakeFirst();
}

export async function listRevisions(db: Kysely<Database>, designId: string) {
  const rows = await db
    .selectFrom('design_revisions as r')
    .innerJoin('users as u', 'u.id', 'r.created_by')
    .select([
      'r.rev',
      'r.message',
      'r.created_at as createdAt',
      'u.id as createdById',
      'u.name as createdByName',
    ])
    .where('r.design_id', '=', designId)
    .orderBy('r.rev', 'desc')
    .execute();
  return rows.map(({ createdById, createdByName, ...r }) => ({
    ...r,
    createdBy: { id: createdById, name: createdByName },
  }));
}

export async function findRevision(db: Kysely<Database>, designId: string, rev: number) {
  const r = await db
    .selectFrom('design_revisions as r')
    .innerJoin('users as u', 'u.id', 'r.created_by')
    .select([
      'r.rev',
      'r.document',
      'r.message',
      'r.created_at as createdAt',
      'u.id as createdById',
      'u.name as createdByName',
    ])
    .where('r.design_id', '=', designId)
    .where('r.rev', '=', rev)
    .executeTakeFirst();
  if (!r) return undefined;
  const { createdById, createdByName, ...rest } = r;
  return { ...rest, createdBy: { id: createdById, name: createdByName } };
}

/** Creates the design with revision 1. */
/** What a save stores: the document, the design's name taken from it, the message and who saved. */
interface SavedRevision {
  userId: string;
  name: string;
  document: unknown;
  message: string | null;
}

/** The immutable revision row `rev` of a design, written inside the save's transaction. */
async function addRevisionRow(tx: Transaction<Database>, designId: string, rev: number, v: SavedRevision) {
  await tx
    .insertInto('design_revisions')
    .values({
      design_id: designId,
      rev,
      document: JSON.stringify(v.document),
      message: v.message,
      created_by: v.userId,
    })
    .execute();
}

export async function insertDesign(
  db: Kysely<Database>,
  v: SavedRevision & { workspaceId: string },
): Promise<string> {
  return db.transaction().execute(async (tx) => {
    const d = await tx
      .insertInto('designs')
      .values({ workspace_id: v.workspaceId, name: v.name, created_by: v.userId, latest_rev: 1 })
      .returning('id')
      .executeTakeFirstOrThrow();
    await addRevisionRow(tx, d.id, 1, v);
    return d.id;
  });
}

/**
 * Appends the next revision. Bumping latest_rev first takes the row lock, so two concurrent
 * saves get consecutive numbers instead of colliding.
 */
export async function insertRevision(
  db: Kysely<Database>,
  v: SavedRevision & { designId: string },
): Promise<number> {
  return db.transaction().execute(async (tx) => {
    const d = await tx
      .updateTable('designs')
      .set((eb) => ({ latest_rev: eb('latest_rev', '+', 1), name: v.name, updated_at: new Date() }))
      .where('id', '=', v.designId)
      .returning('latest_rev')
      .executeTakeFirstOrThrow();
    await addRevisionRow(tx, v.designId, d.latest_rev, v);
    return d.latest_rev;
  });
}

export async function setArchived(db: Kysely<Database>, designId: string, archived: boolean): Promise<void> {
  await db
    .updateTable('designs')
    .set({ archived_at: archived ? new Date() : null })
    .where('id', '=', designId)
    .execute();
}
