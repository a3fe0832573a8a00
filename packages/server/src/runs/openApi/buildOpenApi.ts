import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { z } from 'zod';
import { designJsonSchema } from '@sigmatail/engine';
import type { RouteAccess, RouteAccessTable } from '../../http/routeAccess.js';
import { lotsDetails, lotsSummaries } from '../../lots/lotsOpenApi.js';
import { productionDetails, productionSummaries } from '../../production/productionOpenApi.js';
import type { RouteBodyTable } from '../../http/routeBodies.js';
import { launchRunBody, listRunsQuery, runView, samplesQuery } from '../runSchemas.js';

const SRC = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** Every table exported by the files under src/ named …<suffix>.ts, merged (later files win a duplicate key). */
async function loadTables<T>(suffix: string): Promise<Record<string, T>> {
  const files = (await readdir(SRC, { recursive: true }))
    .filter((f) => new RegExp(`${suffix}\\.(ts|js)$`).test(f) && !f.endsWith('.d.ts'))
    .sort();
  const merged: Record<string, T> = {};
  for (const f of files) {
    const mod = (await import(pathToFileURL(path.join(SRC, f)).href)) as Record<string, Record<string, T>>;
    for (const table of Object.values(mod)) Object.assign(merged, table);
  }
  return merged;
}

/** Every 'METHOD /api/path' → access, from all *RouteAccess.ts tables (as the role matrix test reads them). */
export function loadRouteAccess(): Promise<Record<string, RouteAccess>> {
  return loadTables<RouteAccessTable[string]>('RouteAccess');
}

/** Every 'METHOD /api/path' → its body schema (null: no body), from all *RouteBodies.ts tables. */
export function loadRouteBodies(): Promise<Record<string, RouteBodyTable[string]>> {
  return loadTables<RouteBodyTable[string]>('RouteBodies');
}

/**
 * The JSON Schema of a request body, as clients send it (zod input side). A design document is
 * checked by the engine's parseDesign rather than zod, so its schema is the engine's own.
 */
function bodySchema(schema: z.ZodType): Record<string, unknown> {
  const out = json(schema) as { properties?: Record<string, unknown> };
  if (out.properties && 'document' in out.properties) {
    out.properties.document = { $ref: '#/components/schemas/DesignDocument' };
  }
  return out;
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
  'GET /api/runs/:id/samples': 'The first raw samples as JSON (a scatter preview; not an audited export)',
  'GET /api/openapi.json': 'This document',
  'GET /api/reports/:designId': 'The production report of a design (latest finished run, ratings)',
  'POST /api/reports/:designId/email': 'Mail the production report to a colleague',
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

/** Response details of the runs routes (request bodies of every route come from the *RouteBodies.ts tables). */
const runsDetails: Record<string, object> = {
  'POST /api/runs': {
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
  'GET /api/runs/:id/samples': {
    parameters: Object.entries((json(samplesQuery) as { properties: Record<string, object> }).properties).map(
      ([name, schema]) => ({ name, in: 'query', required: false, schema }),
    ),
    responses: {
      200: ok({
        type: 'object',
        properties: {
          columns: { type: 'array', items: { type: 'string' } },
          rows: {
            type: 'array',
            items: { type: 'array', items: { type: ['number', 'null'] } },
            description: 'one row per sample in column order; null where a value is not finite',
          },
        },
        required: ['columns', 'rows'],
      }),
      409: errorResponse('The run is not done, or was computed by another engine version'),
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
 * role matrix test checks against the routes the app registers), with its roles, the request body
 * of every route that takes one (from the *RouteBodies.ts tables: the zod schemas the routes parse
 * with), and full response schemas for the runs routes.
 */
export async function buildOpenApi(): Promise<Record<string, unknown>> {
  const access = await loadRouteAccess();
  const bodies = await loadRouteBodies();
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
    const details = (runsDetails[route] ?? lotsDetails[route] ?? productionDetails[route] ?? {}) as {
      parameters?: object[];
      responses?: object;
    };
    const body = bodies[route];
    const op = {
      summary: summaries[route] ?? lotsSummaries[route] ?? productionSummaries[route] ?? route,
      'x-sigmatail-access': a === 'public' || a === 'signedIn' ? a : [...a],
      security: a === 'public' ? [] : [{ session: [] }],
      ...(body
        ? {
            requestBody: {
              // A schema that accepts undefined (e.g. logout's) makes the body optional.
              required: !body.safeParse(undefined).success,
              content: {
                'application/json': {
                  schema:
                    route === 'POST /api/runs'
                      ? { $ref: '#/components/schemas/LaunchRun' }
                      : bodySchema(body),
                },
              },
            },
          }
        : {}),
      ...details,
      parameters: [...params, ...(details.parameters ?? [])],
      responses: {
        ...(details.responses ?? { 200: ok() }),
        400: errorResponse('Invalid input; error.field names the field'),
        ...(body
          ? {
              413: errorResponse('Body over the 2 MB limit'),
              415: errorResponse('Body not application/json'),
            }
          : {}),
        ...(method !== 'GET' ? { 403: errorResponse('Cross-site request refused (Origin)') } : {}),
        ...(a === 'public' ? {} : { 401: errorResponse('Not signed in') }),
        ...(Array.isArray(a)
          ? {
              403: errorResponse(
                method !== 'GET' ? 'Role not allowed, or cross-site request refused' : 'Role not allowed',
              ),
            }
          : {}),
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
                position: { type: 'integer', description: 'Malformed JSON: 0-based offset where it breaks' },
                line: { type: 'integer' },
                column: { type: 'integer' },
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
        DesignDocument: designJsonSchema(),
        Run: z.toJSONSchema(runView),
      },
    },
  };
}
