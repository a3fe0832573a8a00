import type { Role } from '@sigmatail/db';

/**
 * Who may call a route: 'public' (anyone), 'signedIn' (any role), or the roles allowed
 * (list admin too: the tables state intent in full, the test checks the app enforces it).
 */
export type RouteAccess = 'public' | 'signedIn' | readonly Role[];

/** Keys are 'METHOD /api/path' exactly as registered, e.g. 'GET /api/designs/:id'. */
export type RouteAccessTable = Readonly<Record<string, RouteAccess>>;
