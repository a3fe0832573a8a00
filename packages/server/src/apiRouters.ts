import type { Router } from 'express';
import type { AppDeps } from './appDeps.js';
import { createHealthRouter } from './http/healthRouter.js';
import { createRunsRouter } from './runs/runsRouter.js';

/**
 * Every router mounted under /api, each with paths relative to /api. The role matrix test walks
 * these; a new router goes here and its routes into a *RouteAccess.ts table.
 */
export function apiRouters(deps: AppDeps): Router[] {
  return [createHealthRouter(deps), createRunsRouter(deps)];
}
