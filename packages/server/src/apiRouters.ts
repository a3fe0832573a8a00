import type { Router } from 'express';
import type { AppDeps } from './appDeps.js';
import { createAuditRouter } from './audit/auditRouter.js';
import { createAuthRouter } from './auth/authRouter.js';
import { createPasswordResetRouter } from './auth/passwordResetRouter.js';
import { createWorkspaceSwitchRouter } from './auth/workspaceSwitchRouter.js';
import { createDesignsRouter } from './designs/designsRouter.js';
import { createDevInboxRouter } from './devInbox/devInboxRouter.js';
import { createHealthRouter } from './http/healthRouter.js';
import { createReportsRouter } from './reports/reportsRouter.js';
import { createLotsRouter } from './lots/lotsRouter.js';
import { createPlansRouter } from './production/plansRouter.js';
import { createPricesRouter } from './production/pricesRouter.js';
import { createStudiesRouter } from './production/studiesRouter.js';
import { createRunsRouter } from './runs/runsRouter.js';
import { createTestLimitsRouter } from './testLimits/testLimitsRouter.js';
import { createAcceptInviteRouter } from './users/acceptInviteRouter.js';
import { createInvitesRouter } from './users/invitesRouter.js';
import { createUsersRouter } from './users/usersRouter.js';
import { createWorkspaceRouter } from './workspace/workspaceRouter.js';

/**
 * Every router mounted under /api, each with paths relative to /api. The role matrix test walks
 * these: a new route needs an entry in a *RouteAccess.ts table or that test fails.
 */
export function apiRouters(deps: AppDeps): Router[] {
  return [
    createHealthRouter(deps),
    createAuthRouter(deps),
    createPasswordResetRouter(deps),
    createWorkspaceSwitchRouter(deps),
    createAcceptInviteRouter(deps),
    createInvitesRouter(deps),
    createUsersRouter(deps),
    createWorkspaceRouter(deps),
    createDevInboxRouter(deps),
    createAuditRouter(deps),
    createDesignsRouter(deps),
    createRunsRouter(deps),
    createReportsRouter(deps),
    createLotsRouter(deps),
    createTestLimitsRouter(deps),
    createPricesRouter(deps),
    createPlansRouter(deps),
    createStudiesRouter(deps),
  ];
}
