import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express from 'express';
import type { AppDeps } from './appDeps.js';
import { loadSession } from './auth/loadSession.js';
import { apiRouters } from './apiRouters.js';
import { apiNotFound, errorHandler, JSON_BODY_LIMIT_BYTES } from './http/errorHandler.js';
import { requireJsonBody } from './http/requireJsonBody.js';
import { createLogger, requestLogger } from './http/logger.js';
import { createProbesRouter } from './http/probesRouter.js';
import { sameOriginGuard } from './http/sameOriginGuard.js';
import { securityHeaders } from './http/securityHeaders.js';

export type { AppDeps } from './appDeps.js';

/**
 * The whole HTTP app: every API router under /api (JSON errors), and the built web app with
 * SPA fallback when config.webDist exists. Listening is left to the caller.
 */
export function createApp(deps: AppDeps): express.Express {
  const app = express();
  app.disable('x-powered-by');
  // By default req.ip (the rate-limit key) is the socket address: X-Forwarded-For is not trusted,
  // since any local client could forge it. A deployment behind a proxy sets SIGMATAIL_TRUST_PROXY.
  app.set('trust proxy', deps.config.trustProxy);
  app.use(requestLogger(deps.logger ?? createLogger()));
  app.use(securityHeaders(deps.config));
  app.use(createProbesRouter(deps));

  const api = express.Router();
  api.use(sameOriginGuard(deps.config));
  api.use(requireJsonBody);
  api.use(express.json({ limit: JSON_BODY_LIMIT_BYTES }));
  api.use(cookieParser());
  api.use(loadSession(deps));
  for (const router of apiRouters(deps)) api.use(router);
  api.use(apiNotFound);
  app.use('/api', api);

  const dist = deps.config.webDist;
  if (dist && existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false }));
    // Client-side routes (e.g. /designs/123) get the SPA shell; /api never reaches here.
    app.get(/^\/(?!api(\/|$)).*/, (_req, res) => res.sendFile(path.join(dist, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
