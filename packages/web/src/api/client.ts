/**
 * Every HTTP call the web app makes lives here. Errors come back as `ApiError` carrying the
 * server's message and, when the server names one, the offending field.
 */
import type {
  ArchivedFilter,
  AuditEvent,
  DesignDetail,
  DesignSummary,
  InboxMessage,
  InboxSummary,
  InviteInfo,
  Me,
  PendingInvite,
  ProductionReport,
  Revision,
  RevisionSummary,
  Role,
  RunLaunch,
  RunResultsBody,
  RunView,
  UserRow,
  Workspace,
  WorkspaceSettings,
} from './types.js';

export interface ApiIssue {
  path: string;
  message: string;
}

export class ApiError extends Error {
  readonly status: number;
  readonly field?: string;
  readonly issues?: ApiIssue[];
  constructor(status: number, message: string, field?: string, issues?: ApiIssue[]) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.field = field;
    this.issues = issues;
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Turn a failed response into an ApiError, whatever its body looks like. */
export async function toApiError(res: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // Not JSON (a proxy page or an empty body): fall back to the status text.
  }
  const err = (body as { error?: { message?: unknown; field?: unknown; issues?: unknown } } | null)?.error;
  const message =
    typeof err?.message === 'string' && err.message
      ? err.message
      : `Request failed (${res.status}${res.statusText ? ` ${res.statusText}` : ''})`;
  return new ApiError(
    res.status,
    message,
    typeof err?.field === 'string' ? err.field : undefined,
    Array.isArray(err?.issues) ? (err.issues as ApiIssue[]) : undefined,
  );
}

/** One JSON request to `/api…`. Network failures become status 0. */
export async function request<T>(method: Method, path: string, body?: unknown): Promise<T> {
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers:
        body === undefined
          ? { accept: 'application/json' }
          : { 'content-type': 'application/json', accept: 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'Cannot reach the Sigmatail server. Check your connection and try again.');
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

/** The first raw samples of a run (a non-finite value comes back as NaN). */
export interface SampleSubset {
  columns: string[];
  rows: number[][];
}

function qs(params: Record<string, string | number | boolean | undefined>): string {
  const sp = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== '') sp.set(k, String(v));
  const s = sp.toString();
  return s ? `?${s}` : '';
}

const enc = encodeURIComponent;

export const api = {
  auth: {
    me: () => request<Me>('GET', '/auth/me'),
    login: (email: string, password: string) => request<Me>('POST', '/auth/login', { email, password }),
    /** Ends this session; `everywhere` ends every session of the user, on every device. */
    logout: (everywhere = false) =>
      request<void>('POST', '/auth/logout', everywhere ? { everywhere: true } : undefined),
    forgot: (email: string) => request<void>('POST', '/auth/forgot', { email }),
    reset: (token: string, password: string) => request<void>('POST', '/auth/reset', { token, password }),
    invite: (token: string) => request<{ invite: InviteInfo }>('GET', `/invites/${enc(token)}`),
    acceptInvite: (token: string, name: string, password: string) =>
      request<Me>('POST', '/auth/accept-invite', { token, name, password }),
  },
  admin: {
    users: () => request<{ users: UserRow[]; invites: PendingInvite[] }>('GET', '/users'),
    setRole: (id: string, role: Role) => request<unknown>('PATCH', `/users/${enc(id)}`, { role }),
    removeUser: (id: string) => request<void>('DELETE', `/users/${enc(id)}`),
    invite: (email: string, role: Role) => request<unknown>('POST', '/invites', { email, role }),
    workspace: () => request<{ workspace: Workspace }>('GET', '/workspace'),
    updateWorkspace: (patch: { name?: string; settings?: Partial<WorkspaceSettings> }) =>
      request<unknown>('PATCH', '/workspace', patch),
    inbox: () => request<{ messages: InboxSummary[] }>('GET', '/dev/inbox'),
    inboxMessage: (id: string) => request<{ message: InboxMessage }>('GET', `/dev/inbox/${enc(id)}`),
    audit: () => request<{ events: AuditEvent[] }>('GET', '/audit'),
  },
  designs: {
    list: (q = '', archived: ArchivedFilter = 'exclude') =>
      request<{ designs: DesignSummary[] }>('GET', `/designs${qs({ q, archived })}`),
    get: (id: string) => request<{ design: DesignDetail }>('GET', `/designs/${enc(id)}`),
    create: (document: unknown, message?: string) =>
      request<{ design: DesignDetail }>('POST', '/designs', { document, message }),
    revisions: (id: string) =>
      request<{ revisions: RevisionSummary[] }>('GET', `/designs/${enc(id)}/revisions`),
    revision: (id: string, rev: number) =>
      request<{ revision: Revision }>('GET', `/designs/${enc(id)}/revisions/${rev}`),
    saveRevision: (id: string, document: unknown, message?: string) =>
      request<{ revision: Revision }>('POST', `/designs/${enc(id)}/revisions`, { document, message }),
    archive: (id: string, archived = true) =>
      request<{ design: DesignDetail }>('POST', `/designs/${enc(id)}/archive`, { archived }),
  },
  reports: {
    get: (designId: string) => request<{ report: ProductionReport }>('GET', `/reports/${enc(designId)}`),
    email: (designId: string, to: string, note?: string) =>
      request<{ sent: boolean; to: string }>('POST', `/reports/${enc(designId)}/email`, { to, note }),
  },
  runs: {
    list: (filter: { designId?: string; status?: string } = {}) =>
      request<{ runs: RunView[] }>('GET', `/runs${qs(filter)}`),
    get: (id: string) => request<{ run: RunView }>('GET', `/runs/${enc(id)}`),
    launch: (launch: RunLaunch) => request<{ id: string }>('POST', '/runs', launch),
    cancel: (id: string) => request<{ run: RunView }>('POST', `/runs/${enc(id)}/cancel`),
    results: (id: string) => request<RunResultsBody>('GET', `/runs/${enc(id)}/results`),
    sampleHead: async (id: string, maxRows: number): Promise<SampleSubset> => {
      const head = await request<{ columns: string[]; rows: (number | null)[][] }>(
        'GET',
        `/runs/${enc(id)}/samples${qs({ limit: maxRows })}`,
      );
      return { columns: head.columns, rows: head.rows.map((r) => r.map((x) => x ?? Number.NaN)) };
    },
    csvUrl: (id: string) => `/api/runs/${enc(id)}/export.csv`,
    jsonUrl: (id: string) => `/api/runs/${enc(id)}/export.json`,
  },
};
