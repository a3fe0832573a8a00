import type { ColumnType, Generated, Insertable, Selectable, Updateable } from 'kysely';

/** Roles per workspace. admin may do everything; viewer is read only. */
export const ROLES = ['admin', 'engineer', 'production', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** A jsonb column: read as T, written as a JSON string (pg would turn JS arrays into SQL arrays). */
export type Json<T> = ColumnType<T, string, string>;
/** A timestamptz column the database fills in. */
export type CreatedAt = ColumnType<Date, Date | string | undefined, never>;
export type Timestamp = ColumnType<Date, Date | string, Date | string>;
export type NullableTimestamp = ColumnType<
  Date | null,
  Date | string | null | undefined,
  Date | string | null
>;

/** Workspace-wide defaults used by the web app when a run is set up. */
export interface WorkspaceSettings {
  /** Default Monte Carlo sample count for a new run. */
  defaultSamples: number;
  /** Default sampling plan for a new run. */
  defaultPlan: 'random' | 'lhs' | 'sobol';
  /** Default yield target as a fraction (0.99 = 99 %), used by the tolerance plan search. */
  defaultYieldTarget: number;
}

export interface WorkspacesTable {
  id: Generated<string>;
  name: string;
  settings: Json<WorkspaceSettings>;
  created_at: CreatedAt;
}

export interface UsersTable {
  id: Generated<string>;
  /** Stored lower-cased; unique. */
  email: string;
  name: string;
  password_hash: string;
  /** Bumped to invalidate every session token of the user (sign-out everywhere, password reset). */
  session_epoch: Generated<number>;
  created_at: CreatedAt;
}

export interface MembershipsTable {
  user_id: string;
  workspace_id: string;
  role: Role;
  created_at: CreatedAt;
}

export interface InvitesTable {
  id: Generated<string>;
  workspace_id: string;
  email: string;
  role: Role;
  /** SHA-256 hex of the token sent by mail; the token itself is never stored. */
  token_hash: string;
  invited_by: string;
  expires_at: Timestamp;
  accepted_at: NullableTimestamp;
  created_at: CreatedAt;
}

/** A signed-in session; the session token carries its id, and a revoked or expired row refuses the token. */
export interface SessionsTable {
  id: Generated<string>;
  user_id: string;
  created_at: CreatedAt;
  expires_at: Timestamp;
  /** Set by sign-out (this session) or sign-out everywhere (every session of the user). */
  revoked_at: NullableTimestamp;
}

/** A rate-limit counter shared by every server process: hits of `key` since window_start. */
export interface AuthThrottleTable {
  key: string;
  hits: number;
  window_start: Timestamp;
}

export interface PasswordResetsTable {
  id: Generated<string>;
  user_id: string;
  /** SHA-256 hex of the token sent by mail. */
  token_hash: string;
  expires_at: Timestamp;
  used_at: NullableTimestamp;
  created_at: CreatedAt;
}

export interface DesignsTable {
  id: Generated<string>;
  workspace_id: string;
  /** The latest revision's document name, kept here for listing and search. */
  name: string;
  created_by: string;
  created_at: CreatedAt;
  updated_at: ColumnType<Date, Date | string | undefined, Date | string>;
  /** Highest revision number (1 after the first save). */
  latest_rev: ColumnType<number, number | undefined, number>;
  archived_at: NullableTimestamp;
}

/** Immutable: a database trigger refuses UPDATE on this table. */
export interface DesignRevisionsTable {
  id: Generated<string>;
  design_id: string;
  rev: number;
  /** The design document as submitted (part values as entered, e.g. '4k7'). */
  document: Json<unknown>;
  message: string | null;
  created_by: string;
  created_at: CreatedAt;
}

/** Mail received by the local SMTP fake. */
export interface DevMailTable {
  id: Generated<string>;
  mail_from: string;
  mail_to: string;
  subject: string;
  text: string;
  html: string | null;
  received_at: CreatedAt;
}

export interface AuditEventsTable {
  id: Generated<string>;
  workspace_id: string | null;
  user_id: string | null;
  /** e.g. 'auth.login', 'invite.create', 'user.role', 'design.create'. */
  action: string;
  /** What was acted on, e.g. a design id or an email. */
  target: string | null;
  detail: Json<Record<string, unknown>>;
  at: CreatedAt;
}

// ---- runs tables: the runs work adds its table types here (and its entries at the end of Database) ----

export type RunStatus = 'queued' | 'running' | 'merging' | 'done' | 'failed' | 'cancelled';
export type RunPlanKind = 'random' | 'lhs' | 'sobol';

/** One analysis of one design revision; the row is also the run's progress counter. */
export interface RunsTable {
  id: Generated<string>;
  workspace_id: string;
  design_id: string;
  revision: number;
  created_by: string;
  status: ColumnType<RunStatus, RunStatus | undefined, RunStatus>;
  samples: number;
  seed: string;
  plan: RunPlanKind;
  chunk_size: number;
  analyses: Json<{
    influence?: boolean;
    varianceIndices?: boolean;
    worstCase?: boolean;
    largeSignal?: boolean;
    largeSignalSamples?: number;
  }>;
  /** Snapshot of the revision's document, so a run never depends on later edits. */
  design: Json<unknown>;
  engine_version: string;
  chunk_total: number;
  chunks_done: ColumnType<number, number | undefined, number>;
  error: string | null;
  /** The worker merging the run, and until when its claim holds (taken over after expiry). */
  merge_owner: string | null;
  merge_lease_until: NullableTimestamp;
  /** 'pending' when the owner must be mailed (large runs), 'sent' once done. */
  notify_state: 'pending' | 'sent' | null;
  created_at: CreatedAt;
  started_at: NullableTimestamp;
  finished_at: NullableTimestamp;
}

/** The queue: one row per chunk of a run, leased by a worker, holding the chunk result once done. */
export interface RunChunksTable {
  run_id: string;
  chunk_index: number;
  state: ColumnType<'pending' | 'leased' | 'done', 'pending' | 'leased' | 'done' | undefined>;
  lease_owner: string | null;
  lease_until: NullableTimestamp;
  attempts: ColumnType<number, number | undefined, number>;
  /** The engine's ChunkResult (json column: the number text is kept verbatim). */
  result: ColumnType<unknown, string | null | undefined, string | null>;
  /** A chunk's result in the engine's binary layout (encodeChunkResult), when stored so. */
  result_bin: ColumnType<Buffer | null, Buffer | null | undefined, Buffer | null>;
  done_at: NullableTimestamp;
}

/** The merged results of a finished run (the engine's RunResults). */
export interface RunResultsTable {
  run_id: string;
  results: Json<unknown>;
  valid_count: number | null;
  joint_yield: number | null;
  created_at: CreatedAt;
}

export type Run = Selectable<RunsTable>;
export type RunChunk = Selectable<RunChunksTable>;
export type RunResultRow = Selectable<RunResultsTable>;

// ---- end of runs tables ----

// ---- lots tables ----

/** Per tube: [a1, b1, a2, b2] as measured (Ia mA and gm mA/V, or mu and rp Ω) and the model multipliers [perv1, perv2, mu1, mu2]. */
export type TubeLotData = { sections: number[][]; multipliers: number[][] };
/** Resistor lot: one value per part, ohms. */
export type ResistorLotData = { values: number[] };

/** A measured lot uploaded as CSV (per workspace). */
export interface LotsTable {
  id: Generated<string>;
  workspace_id: string;
  name: string;
  kind: 'resistor' | 'tube';
  /** What each row holds: 'ohms' (resistor), 'ia-gm' or 'mu-rp' (tube sections). */
  quantity: 'ohms' | 'ia-gm' | 'mu-rp';
  tube_type: string | null;
  /** Tube lots: the test point the sections were measured at (volts). */
  test_point: ColumnType<{ va: number; vg: number } | null, string | null | undefined, string | null>;
  file_name: string | null;
  count: number;
  data: Json<ResistorLotData | TubeLotData>;
  created_by: string;
  created_at: CreatedAt;
}

export type Lot = Selectable<LotsTable>;

// ---- end of lots tables ----
// ---- production planning tables (prices, plans, pairing and ageing studies) ----

/** A workspace's price table (the engine's PriceTable). */
export interface PriceTablesTable {
  workspace_id: string;
  prices: Json<unknown>;
  updated_by: string | null;
  updated_at: ColumnType<Date, Date | undefined, Date>;
}

/** A saved tolerance plan: the search's target and result, the chosen assignment, the confirming run. */
export interface ProductionPlansTable {
  id: Generated<string>;
  workspace_id: string;
  design_id: string;
  revision: number;
  created_by: string | null;
  target: Json<unknown>;
  result: Json<unknown>;
  assignment: ColumnType<unknown, string | null | undefined, string | null>;
  /** The design revision saved with the chosen classes, which the confirming run analyses. */
  confirm_revision: number | null;
  confirm_run_id: string | null;
  created_at: CreatedAt;
}

/** A saved pairing comparison, ageing result or chosen test limits of one design revision. */
export interface ProductionStudiesTable {
  id: Generated<string>;
  workspace_id: string;
  design_id: string;
  revision: number;
  kind: 'pairing' | 'ageing' | 'limits';
  created_by: string | null;
  input: Json<unknown>;
  result: Json<unknown>;
  created_at: CreatedAt;
}

// ---- end of production planning tables ----

/** Every table of the application database. */
export interface Database {
  workspaces: WorkspacesTable;
  users: UsersTable;
  memberships: MembershipsTable;
  invites: InvitesTable;
  password_resets: PasswordResetsTable;
  sessions: SessionsTable;
  auth_throttle: AuthThrottleTable;
  designs: DesignsTable;
  design_revisions: DesignRevisionsTable;
  dev_mail: DevMailTable;
  audit_events: AuditEventsTable;
  // runs tables below
  runs: RunsTable;
  run_chunks: RunChunksTable;
  run_results: RunResultsTable;
  // lots tables below
  lots: LotsTable;
  // production planning tables below
  price_tables: PriceTablesTable;
  production_plans: ProductionPlansTable;
  production_studies: ProductionStudiesTable;
}

export type Workspace = Selectable<WorkspacesTable>;
export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type UserUpdate = Updateable<UsersTable>;
export type Membership = Selectable<MembershipsTable>;
export type Invite = Selectable<InvitesTable>;
export type PasswordReset = Selectable<PasswordResetsTable>;
export type Design = Selectable<DesignsTable>;
export type DesignRevision = Selectable<DesignRevisionsTable>;
export type DevMail = Selectable<DevMailTable>;
export type AuditEvent = Selectable<AuditEventsTable>;
