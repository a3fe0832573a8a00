import type { Role } from '../api/types.js';

export type Action = 'editDesign' | 'launchRun' | 'export' | 'admin' | 'planProduction';

/** Who may do what; mirrors the server's role rules so the UI never offers a refused action. */
const ALLOWED: Record<Action, readonly Role[]> = {
  editDesign: ['admin', 'engineer'],
  launchRun: ['admin', 'engineer', 'production'],
  export: ['admin', 'engineer', 'production'],
  admin: ['admin'],
  planProduction: ['admin', 'engineer', 'production'],
};

export function can(role: Role | undefined, action: Action): boolean {
  return role !== undefined && ALLOWED[action].includes(role);
}
