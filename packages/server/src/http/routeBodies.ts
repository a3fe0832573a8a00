import type { z } from 'zod';

/**
 * The JSON body each state-changing route takes, as the zod schema the route itself parses with
 * (null: the route takes no body). Keys are 'METHOD /api/path' as in the *RouteAccess.ts tables.
 * The OpenAPI document describes request bodies from these tables, and a test fails for any
 * POST/PUT/PATCH/DELETE route that is in none of them.
 */
export type RouteBodyTable = Readonly<Record<string, z.ZodType | null>>;
