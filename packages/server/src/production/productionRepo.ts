import type { Database } from '@sigmatail/db';
import type { Kysely } from 'kysely';

/** All Kysely code of production planning: price tables, saved plans and studies. */

export async function findPrices(db: Kysely<Database>, workspaceId: string) {
  return db
    .selectFrom('price_tables')
    .select(['prices', 'updated_at'])
    .where('workspace_id', '=', workspaceId)
    .executeTakeFirst();
}

export async function upsertPrices(
  db: Kysely<Database>,
  workspaceId: string,
  userId: string,
  prices: unknown,
) {
  await db
    .insertInto('price_tables')
    .values({ workspace_id: workspaceId, prices: JSON.stringify(prices), updated_by: userId })
    .onConflict((oc) =>
      oc
        .column('workspace_id')
        .doUpdateSet({ prices: JSON.stringify(prices), updated_by: userId, updated_at: new Date() }),
    )
    .execute();
}

/** A design revision of the workspace, or undefined (wrong workspace, unknown id or revision). */
export async function findDesignRevision(
  db: Kysely<Database>,
  workspaceId: string,
  designId: string,
  revision?: number,
) {
  const design = await db
    .selectFrom('designs')
    .select(['id', 'name', 'latest_rev', 'archived_at'])
    .where('workspace_id', '=', workspaceId)
    .where('id', '=', designId)
    .executeTakeFirst();
  if (!design) return undefined;
  const rev = await db
    .selectFrom('design_revisions')
    .select(['rev', 'document'])
    .where('design_id', '=', design.id)
    .where('rev', '=', revision ?? design.latest_rev)
    .executeTakeFirst();
  return rev && { design, rev: rev.rev, document: rev.document };
}

const planColumns = [
  'p.id',
  'p.design_id',
  'd.name as design_name',
  'p.revision',
  'p.target',
  'p.result',
  'p.assignment',
  'p.confirm_revision',
  'p.confirm_run_id',
  'p.created_at',
] as const;

export async function insertPlan(
  db: Kysely<Database>,
  v: {
    workspaceId: string;
    designId: string;
    revision: number;
    userId: string;
    target: unknown;
    result: unknown;
    assignment: unknown;
    confirmRevision: number | null;
    confirmRunId: string | null;
  },
): Promise<string> {
  const row = await db
    .insertInto('production_plans')
    .values({
      workspace_id: v.workspaceId,
      design_id: v.designId,
      revision: v.revision,
      created_by: v.userId,
      target: JSON.stringify(v.target),
      result: JSON.stringify(v.result),
      assignment: v.assignment === null ? null : JSON.stringify(v.assignment),
      confirm_revision: v.confirmRevision,
      confirm_run_id: v.confirmRunId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function findPlan(db: Kysely<Database>, workspaceId: string, id: string) {
  return db
    .selectFrom('production_plans as p')
    .innerJoin('designs as d', 'd.id', 'p.design_id')
    .select(planColumns)
    .where('p.workspace_id', '=', workspaceId)
    .where('p.id', '=', id)
    .executeTakeFirst();
}

export async function listPlans(db: Kysely<Database>, workspaceId: string, designId?: string) {
  let q = db
    .selectFrom('production_plans as p')
    .innerJoin('designs as d', 'd.id', 'p.design_id')
    .select(planColumns)
    .where('p.workspace_id', '=', workspaceId);
  if (designId) q = q.where('p.design_id', '=', designId);
  return q.orderBy('p.created_at', 'desc').limit(100).execute();
}

/** What a saved study holds: a pairing comparison, an ageing result or chosen test limits. */
export type StudyKind = 'pairing' | 'ageing' | 'limits';

export async function insertStudy(
  db: Kysely<Database>,
  v: {
    workspaceId: string;
    designId: string;
    revision: number;
    userId: string;
    kind: StudyKind;
    input: unknown;
    result: unknown;
  },
): Promise<string> {
  const row = await db
    .insertInto('production_studies')
    .values({
      workspace_id: v.workspaceId,
      design_id: v.designId,
      revision: v.revision,
      created_by: v.userId,
      kind: v.kind,
      input: JSON.stringify(v.input),
      result: JSON.stringify(v.result),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

/** The latest saved study of a kind for a design of the workspace. */
export async function latestStudy(
  db: Kysely<Database>,
  workspaceId: string,
  designId: string,
  kind: StudyKind,
) {
  return db
    .selectFrom('production_studies')
    .select(['id', 'design_id', 'revision', 'kind', 'input', 'result', 'created_at'])
    .where('workspace_id', '=', workspaceId)
    .where('design_id', '=', designId)
    .where('kind', '=', kind)
    .orderBy('created_at', 'desc')
    .limit(1)
    .executeTakeFirst();
}
