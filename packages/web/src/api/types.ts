/** Shapes of the API's JSON responses, as the web app reads them (see packages/server/src). */
import type { RunResults } from '@sigmatail/engine';

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
  invitedBy: { name: string };
  workspace: { name: string };
  expiresAt: string;
}

export interface UserRow {
  id: string;
  email: string;
  name: string;
  role: Role;
  joinedAt?: string;
}
export interface PendingInvite {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
  createdAt: string;
}

export interface WorkspaceSettings {
  defaultSamples: number;
  defaultPlan: SamplingPlan;
  defaultYieldTarget: number;
}
export interface Workspace {
  id: string;
  name: string;
  settings: WorkspaceSettings;
}

export interface InboxSummary {
  id: string;
  from: string;
  to: string;
  subject: string;
  receivedAt: string;
}
export interface InboxMessage extends InboxSummary {
  text: string;
  html: string | null;
}

export interface AuditEvent {
  id: string;
  action: string;
  target: string | null;
  detail: unknown;
  at: string;
  user: { id: string; name: string; email: string } | null;
}

interface Author {
  id: string;
  name: string;
}
export interface DesignSummary {
  id: string;
  name: string;
  latestRev: number;
  createdAt: string;
  updatedAt: string;
  archivedAt: string | null;
  createdBy?: Author;
  /** From the latest revision (list only). */
  topology?: string | null;
  tube?: string | null;
  bPlus?: number | null;
  /** The design's latest finished run, any revision (list only). */
  latestRun?: {
    id: string;
    revision: number;
    samples: number;
    jointYield: number | null;
    finishedAt: string;
  } | null;
}
export interface RevisionSummary {
  rev: number;
  message: string | null;
  createdAt: string;
  createdBy: Author;
}
export interface Revision extends RevisionSummary {
  document: unknown;
}
export interface DesignDetail extends DesignSummary {
  latestRevision: Revision;
}
export type ArchivedFilter = 'exclude' | 'include' | 'only';

export type RunStatus = 'queued' | 'running' | 'merging' | 'done' | 'failed' | 'cancelled';
export type SamplingPlan = 'random' | 'lhs' | 'sobol';

export interface RunLaunch {
  designId: string;
  revision?: number;
  samples: number;
  seed?: string;
  plan: SamplingPlan;
  analyses?: {
    influence?: boolean;
    varianceIndices?: boolean;
    worstCase?: boolean;
    largeSignal?: boolean;
    largeSignalSamples?: number;
  };
}

export interface RunView {
  id: string;
  designId: string;
  designName: string;
  revision: number;
  status: RunStatus;
  samples: number;
  seed: string;
  plan: SamplingPlan;
  chunkSize: number;
  analyses: Record<string, boolean | number>;
  engineVersion: string;
  progress: { done: number; total: number; fraction: number };
  error: string | null;
  createdBy: Author;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  summary: { validCount: number | null; jointYield: number | null } | null;
}

export interface RunResultsBody {
  run: RunView;
  results: RunResults;
}

/** One spec's line in a production report (GET /api/reports/:designId). */
export interface ReportSpec {
  metric: string;
  label: string | null;
  min: number | null;
  max: number | null;
  yield: number;
  wilson: [number, number];
  ppm: number;
  cp: number | null;
  cpk: number | null;
  cpkInterval: [number, number] | null;
}

/** The production report of a design, gathered by the server. */
export interface ProductionReport {
  workspace: { name: string };
  design: { id: string; name: string; revision: number; topology: string; tube: string };
  warnings: { code: string; message: string }[];
  run: {
    id: string;
    revision: number;
    samples: number;
    seed: string;
    plan: string;
    finishedAt: string | null;
    joint: { yield: number; wilson: [number, number]; clopperPearson: [number, number]; ppm: number };
    specs: ReportSpec[];
  } | null;
  plan: {
    id: string;
    createdAt: string;
    targetPpm: number;
    currency: string;
    chosen: { classes: Record<string, number>; tube: string; cost: number; estimate: PpmInterval } | null;
    confirm: { runId: string; status: string; samples: number; result: PpmInterval | null } | null;
  } | null;
  pairing: {
    createdAt: string;
    revision: number;
    currency: string | null;
    lotSize: number | null;
    strategies: { label: string; reject: PpmInterval; costPerGoodUnit: number; tubesThrownPerUnit: number }[];
  } | null;
  ageing: {
    createdAt: string;
    revision: number;
    asNew: PpmInterval;
    aged: PpmInterval;
    specs: { label: string; margin: number; marginSd: number | null }[];
  } | null;
  limits: {
    createdAt: string;
    metric: string | null;
    measurementSd: number;
    spec: { low?: number; high?: number };
    test: { low?: number; high?: number };
    falseAcceptPpm: number;
    falseRejectPpm: number;
    guardBand: number | null;
  } | null;
  generatedAt: string;
}

/** A reject rate in PPM with its 95 % interval. */
export interface PpmInterval {
  ppm: number;
  lowPpm: number;
  highPpm: number;
}
