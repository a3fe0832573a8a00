import { loginBody, logoutBody } from './auth/authRouter.js';
import { forgotBody, resetBody } from './auth/passwordResetRouter.js';
import { switchBody } from './auth/workspaceSwitchRouter.js';
import { archiveBody, saveBody } from './designs/designsRouter.js';
import type { RouteBodyTable } from './http/routeBodies.js';
import { acceptBody } from './users/acceptInviteRouter.js';
import { inviteBody } from './users/invitesRouter.js';
import { patchBody as userPatchBody } from './users/usersRouter.js';
import { patchBody as workspacePatchBody } from './workspace/workspaceRouter.js';

/** Request bodies of the foundation routes (auth, users, workspace, designs); see RouteBodyTable. */
export const foundationRouteBodies: RouteBodyTable = {
  'POST /api/auth/login': loginBody,
  'POST /api/auth/logout': logoutBody,
  'POST /api/auth/forgot': forgotBody,
  'POST /api/auth/reset': resetBody,
  'POST /api/auth/accept-invite': acceptBody,
  'POST /api/auth/workspace': switchBody,
  'POST /api/invites': inviteBody,
  'DELETE /api/invites/:id': null,
  'PATCH /api/users/:id': userPatchBody,
  'DELETE /api/users/:id': null,
  'PATCH /api/workspace': workspacePatchBody,
  'POST /api/designs': saveBody,
  'POST /api/designs/:id/revisions': saveBody,
  'POST /api/designs/:id/archive': archiveBody,
};
