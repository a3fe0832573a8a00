import type { RequestHandler } from 'express';
import helmet from 'helmet';
import type { AppConfig } from '../config.js';

/**
 * Security headers on every answer (the web app and the API), through helmet. The
 * Content-Security-Policy allows only this origin's scripts, styles, fonts and API: the built web
 * app needs nothing else (fonts are bundled woff2, charts are inline SVG). Style attributes set
 * through the DOM (React style props, d3's selection.style) are not governed by CSP; data: and
 * blob: images are the chart PNG/SVG export. No page may frame the app (clickjacking), and no
 * Referer leaves it (mailed reset and invite links carry their token in the path).
 */
export function securityHeaders(config: AppConfig): RequestHandler {
  const tls = config.appUrl.startsWith('https:');
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        'style-src': ["'self'"],
        'font-src': ["'self'", 'data:'],
        'img-src': ["'self'", 'data:', 'blob:'],
        'connect-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        // Only behind TLS: on plain http://127.0.0.1 it would send the app's own requests to https.
        ...(tls ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    frameguard: { action: 'deny' },
    referrerPolicy: { policy: 'no-referrer' },
    // HSTS means something only on https; on http a browser ignores it anyway.
    strictTransportSecurity: tls ? { maxAge: 180 * 24 * 3600 } : false,
  });
}
