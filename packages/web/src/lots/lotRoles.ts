import type { Role } from '../api/types.js';

/** Who may upload, delete and apply lots (mirrors the server's lots route table). */
export function canManageLots(role: Role | undefined): boolean {
  return role === 'admin' || role === 'engineer' || role === 'production';
}
