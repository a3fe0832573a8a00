/** Shapes of the API's JSON responses, as the web app reads them. */

export const ROLES = ['admin', 'engineer', 'production', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  workspace: { id: string; name: string };
}
export interface Me {
  user: SessionUser;
}

export interface InviteInfo {
  email: string;
  role: Role;
  invitedBy?: string | { name: string; email?: string };
  workspace?: string | { name: string };
}

export interface UserRow {
  id: string;
  email: string;
  name: string;
  role: Role;
  createdAt?: string;
}

export interface Workspace {
  id: string;
  name: string;
  settings?: Record<string, unknown>;
}

export interface InboxSummary {
  id: string;
  to: string;
  subject: string;
  receivedAt?: string;
  date?: string;
}
export interface InboxMessage extends InboxSummary {
  from?: string;
  text?: string;
  html?: string;
}

export interface AuditEntry {
  id: string;
  at?: string;
  createdAt?: string;
  action: string;
  actorEmail?: string;
  actor?: string | { email: string; name?: string };
  target?: string;
  detail?: unknown;
}

export interface DesignSummary {
  id: string;
  name: string;
  archived?: boolean;
  revision?: number;
  latestRevision?: number;
  updatedAt?: string;
  topology?: string;
}
export interface DesignDetail extends DesignSummary {
  document: unknown;
}
export interface RevisionSummary {
  revision: number;
  message?: string | null;
  createdAt?: string;
  author?: string | { name: string; email?: string };
  authorName?: string;
}
export interface Revision extends RevisionSummary {
  document: unknown;
}

export type RunStatus = 'queued' | 'running' | 'done' | 'completed' | 'failed' | 'cancelled' | 'canceled';
export type SamplingPlan = 'random' | 'lhs' | 'sobol';

export interface RunLaunch {
  designId: string;
  revision?: number;
  samples: number;
  seed?: string;
  plan: SamplingPlan;
  analyses?: { influence?: boolean; varianceIndices?: boolean; worstCase?: boolean };
}

export interface RunSummary {
  id: string;
  designId: string;
  designName?: string;
  revision?: number;
  status: RunStatus;
  samples: number;
  seed: string;
  plan: SamplingPlan;
  createdAt?: string;
  finishedAt?: string | null;
  progress?: number;
  chunksDone?: number;
  chunksTotal?: number;
  error?: string | null;
}
export type RunDetail = RunSummary;

/** Results as the engine's `mergeChunks` produces them; read defensively. */
export type RunResultsPayload = { results: unknown } | Record<string, unknown>;
