import type { ColumnType, Generated, Kysely } from 'kysely';

// TEMPORARY until db/src/schema.ts exists: the runs block, then Db = Kysely<Database>.
export type RunStatus = 'queued' | 'running' | 'merging' | 'done' | 'failed' | 'cancelled';
export type RunPlanKind = 'random' | 'lhs' | 'sobol';
type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;

export interface RunsTable {
  id: Generated<string>;
  workspace_id: number;
  design_id: number;
  revision: number;
  created_by: number;
  status: ColumnType<RunStatus, RunStatus | undefined, RunStatus>;
  samples: number;
  seed: string;
  plan: RunPlanKind;
  chunk_size: number;
  analyses: ColumnType<Record<string, boolean>, string, string>;
  design: ColumnType<unknown, string, string>;
  engine_version: string;
  chunk_total: number;
  chunks_done: ColumnType<number, number | undefined, number>;
  error: string | null;
  merge_owner: string | null;
  merge_lease_until: Date | null;
  notify_state: 'pending' | 'sent' | null;
  created_at: Timestamp;
  started_at: Date | null;
  finished_at: Date | null;
}
export interface RunChunksTable {
  run_id: string;
  chunk_index: number;
  state: ColumnType<'pending' | 'leased' | 'done', 'pending' | 'leased' | 'done' | undefined>;
  lease_owner: string | null;
  lease_until: Date | null;
  attempts: ColumnType<number, number | undefined, number>;
  result: ColumnType<unknown, string | null, string | null>;
  done_at: Date | null;
}
export interface RunResultsTable {
  run_id: string;
  results: ColumnType<unknown, string, string>;
  valid_count: number | null;
  joint_yield: number | null;
  created_at: Timestamp;
}
export interface RunsDatabase {
  runs: RunsTable;
  run_chunks: RunChunksTable;
  run_results: RunResultsTable;
}
export type Db = Kysely<RunsDatabase>;
