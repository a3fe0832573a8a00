import type { Database, RunStatus } from '@sigmatail/db';
import { sql, type Kysely, type Transaction } from 'kysely';
import type { RunView } from './runSchemas.js';

export type DbOrTrx = Kysely<Database> | Transaction<Database>;

/** All run SQL used by the API (the worker's side lives in chunkQueue and runWorkStore). */

function runsQuery(db: DbOrTrx) {
  return db
    .selectFrom('runs as r')
    .innerJoin('designs as d', 'd.id', 'r.design_id')
    .innerJoin('users as u', 'u.id', 'r.created_by')
    .leftJoin('run_results as rr', 'rr.run_id', 'r.id')
    .select([
      'r.id',
      'r.workspace_id',
      'r.design_id',
      'd.name as design_name',
      'r.revision',
      'r.status',
      'r.samples',
      'r.seed',
      'r.plan',
      'r.chunk_size',
      'r.analyses',
      'r.engine_version',
      'r.chunk_total',
      'r.chunks_done',
      'r.error',
      'u.id as user_id',
      'u.name as user_name',
      'r.created_at',
      'r.started_at',
      'r.finished_at',
      'rr.valid_count',
      'rr.joint_yield',
      sql<boolean>`rr.run_id is not null`.as('has_results'),
    ]);
}
type RunRow = Awaited<ReturnType<ReturnType<typeof runsQuery>['executeTakeFirstOrThrow']>>;

function present(r: RunRow): RunView {
  const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
  return {
    id: r.id,
    designId: r.design_id,
    designName: r.design_name,
    revision: r.revision,
    status: r.status,
    samples: r.samples,
    seed: r.seed,
    plan: r.plan,
    chunkSize: r.chunk_size,
    analyses: r.analyses as Record<string, boolean | number>,
    engineVersion: r.engine_version,
    progress: {
      done: r.chunks_done,
      total: r.chunk_total,
      fraction: r.chunk_total ? r.chunks_done / r.chunk_total : 0,
    },
    error: r.error,
    createdBy: { id: r.user_id, name: r.user_name },
    createdAt: iso(r.created_at)!,
    startedAt: iso(r.started_at),
    finishedAt: iso(r.finished_at),
    summary: r.has_results ? { validCount: r.valid_count, jointYield: r.joint_yield } : null,
  };
}

export async function findRun(db: DbOrTrx, workspaceId: string, id: string): Promise<RunView | undefined> {
  const r = await runsQuery(db)
    .where('r.workspace_id', '=', workspaceId)
    .where('r.id', '=', id)
    .executeTakeFirst();
  return r && present(r);
}

/** A run of any workspace with its workspace id (the caller checks access). */
export async function findRunWithWorkspace(
  db: DbOrTrx,
  id: string,
): Promise<{ view: RunView; workspaceId: string } | undefined> {
  const r = await runsQuery(db).where('r.id', '=', id).executeTakeFirst();
  return r && { view: present(r), workspaceId: r.workspace_id };
}

export async function listRuns(
  db: DbOrTrx,
  workspaceId: string,
  f: { designId?: string; status?: RunStatus; limit: number },
): Promise<RunView[]> {
  let q = runsQuery(db).where('r.workspace_id', '=', workspaceId);
  if (f.designId) q = q.where('r.design_id', '=', f.designId);
  if (f.status) q = q.where('r.status', '=', f.status);
  const rows = await q.orderBy('r.created_at', 'desc').orderBy('r.id').limit(f.limit).execute();
  return rows.map(present);
}

/** Marks an active run cancelled; returns false when it had already ended. */
export async function cancelRun(db: DbOrTrx, workspaceId: string, id: string): Promise<boolean> {
  const r = await db
    .updateTable('runs')
    .set({ status: 'cancelled', finished_at: sql<Date>`now()`, merge_owner: null, merge_lease_until: null })
    .where('workspace_id', '=', workspaceId)
    .where('id', '=', id)
    .where('status', 'in', ['queued', 'running', 'merging'])
    .returning('id')
    .executeTakeFirst();
  return r !== undefined;
}

/** The stored results document as JSON text (sent as-is, never re-serialised). */
export async function findResultsText(db: DbOrTrx, runId: string): Promise<string | undefined> {
  const r = await db
    .selectFrom('run_results')
    .select(sql<string>`results::text`.as('text'))
    .where('run_id', '=', runId)
    .executeTakeFirst();
  return r?.text;
}

/** The design snapshot a run was launched with. */
export async function findRunDesign(db: DbOrTrx, runId: string): Promise<unknown> {
  const r = await db.selectFrom('runs').select('design').where('id', '=', runId).executeTakeFirstOrThrow();
  return r.design;
}
