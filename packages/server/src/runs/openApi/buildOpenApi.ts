import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { z } from 'zod';
import type { RouteAccess, RouteAccessTable } from '../../http/routeAccess.js';
import { productionDetails, productionSummaries } from '../../production/productionOpenApi.js';
import { launchRunBody, listRunsQuery, runView } from '../runSchemas.js';

const SRC = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** Every 'METHOD /api/path' → access, from all *RouteAccess.ts tables (as the role matrix test reads them). */
export async function loadRouteAccess(): Promise<Record<string, RouteAccess>> {
  const files = (await readdir(SRC, { recursive: true }))
    .filter((f) => /RouteAccess\.(ts|js)$/.test(f) && !f.endsWith('.d.ts'))
    .sort();
  const merged: Record<string, RouteAccess> = {};
  for (const f of files) {
    const mod = (await import(pathToFileURL(path.join(SRC, f)).href)) as Record<string, RouteAccessTable>;
    for (const table of Object.values(mod)) Object.assign(merged, table);
  }
  return merged;
}

const summaries: Record<string, string> = {
  'GET /api/health': 'Liveness and database check',
  'POST /api/auth/login': 'Sign in (sets the session cookie)',
  'POST /api/auth/logout': 'Sign out (clears the session cookie)',
  'GET /api/auth/me': 'The signed-in user and workspace',
  'POST /api/auth/forgot': 'Mail a password reset link (same answer whether or not the address exists)',
  'POST /api/auth/reset': 'Set a new password with a reset token',
  'GET /api/invites/:token': 'Who invited this address, and with which role',
  'POST /api/auth/accept-invite': 'Accept an invite: set name and password',
  'POST /api/invites': 'Invite a user by e-mail with a role',
  'DELETE /api/invites/:id': 'Withdraw a pending invite',
  'GET /api/auth/workspaces': 'Workspaces the signed-in user belongs to',
  'POST /api/auth/workspace': 'Switch the session to another of the user’s workspaces',
  'GET /api/users': 'Members of the workspace',
  'PATCH /api/users/:id': 'Change a member’s role',
  'DELETE /api/users/:id': 'Remove a member',
  'GET /api/workspace': 'Workspace name and settings',
  'PATCH /api/workspace': 'Change workspace name and settings',
  'GET /api/dev/inbox': 'Mail caught by the local SMTP fake',
  'GET /api/dev/inbox/:id': 'One caught mail',
  'GET /api/audit': 'Audit events of the workspace',
  'GET /api/designs': 'List and search designs',
  'POST /api/designs': 'Create a design (revision 1)',
  'GET /api/designs/:id': 'A design with its latest revision',
  'GET /api/designs/:id/revisions': 'Revisions of a design',
  'GET /api/designs/:id/revisions/:rev': 'One immutable revision',
  'POST /api/designs/:id/revisions': 'Save a new revision',
  'POST /api/designs/:id/archive': 'Archive or restore a design',
  'POST /api/runs': 'Launch a run (queued; workers pick up its chunks)',
  'GET /api/runs': 'List runs, filtered by design and status',
  'GET /api/runs/:id': 'Run status and progress (done chunks / total)',
  'POST /api/runs/:id/cancel': 'Cancel a queued or running run',
  'GET /api/runs/:id/results': 'Stored results of a finished run',
  'GET /api/runs/:id/export.csv':
    'Raw samples (inputs and metrics) regenerated from the seed, streamed as CSV',
  'GET /api/runs/:id/export.json': 'The run and its results as a download',
  'GET /api/openapi.json': 'This document',
};

const json = (schema: z.ZodType) => z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any' });
const errorRef = { $ref: '#/components/schemas/Error' };
const errorResponse = (description: string) => ({
  description,
  content: { 'application/json': { schema: errorRef } },
});
const ok = (schema?: object, description = 'OK', type = 'application/json') =>
  schema ? { description, content: { [type]: { schema } } } : { description };
const runResponse = ok({
  type: 'object',
  properties: { run: { $ref: '#/components/schemas/Run' } },
  required: ['run'],
});

/** Request and response details of the runs routes (other routes are described by access only). */
const runsDetails: Record<string, object> = {
  'POST /api/runs': {
    requestBody: {
      required: true,
      content: { 'application/json': { schema: { $ref: '#/components/schemas/LaunchRun' } } },
    },
    responses: {
      202: ok(
        { type: 'object', properties: { id: { type: 'string', format: 'uuid' } }, required: ['id'] },
        'Queued',
      ),
      404: errorResponse('Design or revision not found'),
      422: errorResponse('The revision cannot run'),
    },
  },
  'GET /api/runs': {
    parameters: Object.entries(
      (json(listRunsQuery) as { properties: Record<string, object> }).properties,
    ).map(([name, schema]) => ({ name, in: 'query', required: false, schema })),
    responses: {
      200: ok({
        type: 'object',
        properties: { runs: { type: 'array', items: { $ref: '#/components/schemas/Run' } } },
      }),
    },
  },
  'GET /api/runs/:id': { responses: { 200: runResponse } },
  'POST /api/runs/:id/cancel': {
    responses: { 200: runResponse, 409: errorResponse('The run had already ended') },
  },
  'GET /api/runs/:id/results': {
    responses: {
      200: ok({
        type: 'object',
        properties: {
          run: { $ref: '#/components/schemas/Run' },
          results: { type: 'object', description: 'The engine’s RunResults (format sigmatail-run-results)' },
        },
      }),
      409: errorResponse('The run is not done'),
    },
  },
  'GET /api/runs/:id/export.json': {
    responses: {
      200: ok({ type: 'object' }, 'Attachment: the run and its results'),
      409: errorResponse('The run is not done'),
    },
  },
  'GET /api/runs/:id/export.csv': {
    responses: {
      200: ok({ type: 'string' }, 'Attachment: header row, then one row per sample', 'text/csv'),
      409: errorResponse('The run is not done'),
    },
  },
};

/**
 * The OpenAPI 3.1 document of the whole API: every route in the *RouteAccess.ts tables (which the
 * role matrix test checks against the routes the app registers), with its roles, and full
 * request/response schemas for the runs routes, generated from their zod schemas.
 */
export async function buildOpenApi(): Promise<Record<string, unknown>> {
  const access = await loadRouteAccess();
  const paths: Record<string, Record<string, object>> = {};
  for (const route of Object.keys(access).sort()) {
    const [method, pattern] = route.split(' ') as [string, string];
    const a = access[route]!;
    const params = [...pattern.matchAll(/:([A-Za-z]+)/g)].map((m) => ({
      name: m[1],
      in: 'path',
      required: true,
      schema: { type: 'string' },
    }));
    const details = (runsDetails[route] ?? productionDetails[route] ?? {}) as {
      parameters?: object[];
      responses?: object;
    };
    const op = {
      summary: summaries[route] ?? productionSummaries[route] ?? route,
      'x-sigmatail-access': a === 'public' || a === 'signedIn' ? a : [...a],
      security: a === 'public' ? [] : [{ session: [] }],
      ...details,
      parameters: [...params, ...(details.parameters ?? [])],
      responses: {
        ...(details.responses ?? { 200: ok() }),
        400: errorResponse('Invalid input; error.field names the field'),
        ...(a === 'public' ? {} : { 401: errorResponse('Not signed in') }),
        ...(Array.isArray(a) ? { 403: errorResponse('Role not allowed') } : {}),
      },
    };
    const key = pattern.replace(/:([A-Za-z]+)/g, '{$1}');
    (paths[key] ??= {})[method.toLowerCase()] = op;
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Sigmatail API',
      version: '1',
      description:
        'Long-tailed-pair phase splitter design, Monte Carlo runs, yield and exports. JSON everywhere; errors are { error: { message, field?, issues? } }.',
    },
    paths,
    components: {
      securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'sigmatail_session' } },
      schemas: {
        Error: {
          type: 'object',
          properties: {
            error: {
              type: 'object',
              properties: {
                message: { type: 'string' },
                field: { type: 'string' },
                issues: {
                  type: 'array',
                  items: {
                    type: 'object',
                    properties: { path: { type: 'string' }, message: { type: 'string' } },
                  },
                },
              },
              required: ['message'],
            },
          },
          required: ['error'],
        },
        LaunchRun: json(launchRunBody),
        Run: z.toJSONSchema(runView),
      },
    },
  };
}
