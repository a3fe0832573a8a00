import type { Request, RequestHandler } from 'express';
import type { AppConfig } from '../config.js';
import { HttpError } from './httpError.js';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function originOf(url: string): string | null {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

/** This request's own origin as the browser addressed it (protocol honours 'trust proxy'). */
function ownOrigin(req: Request): string | null {
  const host = req.get('host');
  return host ? `${req.protocol}://${host}` : null;
}

/**
 * Refuses state-changing requests (every method but GET/HEAD/OPTIONS) that a browser sent from
 * another site: 403 JSON naming the Origin. A browser names the page's origin in `Origin` on every
 * such request (forms and fetch alike) and says `Sec-Fetch-Site`; allowed are the app's own origin
 * (APP_URL, or the Host the request was sent to) and config.allowedOrigins. Clients that are not
 * browsers send neither header and pass: the session cookie (SameSite=Lax) is what a cross-site
 * page could abuse, and only a browser would attach it.
 */
export function sameOriginGuard(config: AppConfig): RequestHandler {
  const allowed = new Set(
    [config.appUrl, ...config.allowedOrigins].map(originOf).filter((o): o is string => o !== null),
  );
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.get('origin');
    if (origin !== undefined) {
      if (allowed.has(origin) || origin === ownOrigin(req)) return next();
      return next(
        new HttpError(403, `cross-site request refused: Origin ${origin} is not this app's origin`, 'Origin'),
      );
    }
    const site = req.get('sec-fetch-site');
    if (site === 'cross-site' || site === 'same-site') {
      return next(
        new HttpError(403, `cross-site request refused: Sec-Fetch-Site is ${site}`, 'Sec-Fetch-Site'),
      );
    }
    next();
  };
}
