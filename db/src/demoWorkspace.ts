import type { Role, WorkspaceSettings } from './schema.js';

/** The fictional demo workshop. */
export const DEMO_WORKSPACE_NAME = 'Fenwick Lane Valve Works';

/** Password of every demo user. */
export const DEMO_PASSWORD = 'tailpair-demo';

/** One demo user per role. */
export const DEMO_USERS: readonly { email: string; name: string; role: Role }[] = [
  { email: 'admin@fenwick.example', name: 'Ada Fenwick', role: 'admin' },
  { email: 'engineer@fenwick.example', name: 'Ezra Lane', role: 'engineer' },
  { email: 'production@fenwick.example', name: 'Priya Holt', role: 'production' },
  { email: 'viewer@fenwick.example', name: 'Victor Marsh', role: 'viewer' },
];

/** Settings a new workspace starts with. */
export const DEFAULT_WORKSPACE_SETTINGS: WorkspaceSettings = {
  defaultSamples: 100_000,
  defaultPlan: 'lhs',
  defaultYieldTarget: 0.99,
};
