import type { Role } from '@sigmatail/db';
import type { SessionUser } from './requireRole.js';

/** The signed-in user as the web app sees it (`GET /api/auth/me`). */
export interface MeBody {
  user: { id: string; email: string; name: string; role: Role; workspace: { id: string; name: string } };
}

export function presentMe(u: SessionUser): MeBody {
  return {
    user: {
      id: u.id,
      email: u.email,
      name: u.name,
      role: u.role,
      workspace: { id: u.workspaceId, name: u.workspaceName },
    },
  };
}
