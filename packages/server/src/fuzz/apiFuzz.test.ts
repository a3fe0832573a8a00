import fc from 'fast-check';
import { ROLES, type Role } from '@sigmatail/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildWorkspaceData, type WorkspaceData } from '../testing/buildWorkspaceData.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import { workspaceSnapshot } from '../testing/workspaceSnapshot.js';

// Property-based fuzzing of every route in the OpenAPI document, as every role and signed out,
// with bad and odd requests: wrong types, huge numbers, NaN/Infinity strings, unicode, oversized
// and deeply nested bodies, invalid JSON, wrong content types, non-UUID and guessed ids (including
// another workspace's real ones). Expected: never a 5xx; every refusal a 4xx JSON error with a
// message; a refused request leaves both workspaces' data exactly as it was.

type Who = 'anonymous' | Role;
interface Op {
  method: string;
  pattern: string;
}
interface Sent {
  op: Op;
  who: Who;
  url: string;
  contentType: string | null;
  body: string | null;
}

let app: TestApp;
let a: WorkspaceData;
let b: WorkspaceData;
let ops: Op[];
const cookies = {} as Record<Who, string | undefined>;

beforeAll(async () => {
  app = await startTestApp();
  a = await buildWorkspaceData(app);
  b = await buildWorkspaceData(app);
  cookies.anonymous = undefined;
  for (const role of ROLES) cookies[role] = a.clients[role].cookie;
  const doc = (await app.client().get('/api/openapi.json')).body as {
    paths: Record<string, Record<string, unknown>>;
  };
  ops = Object.entries(doc.paths).flatMap(([p, methods]) =>
    Object.keys(methods).map((m) => ({ method: m.toUpperCase(), pattern: p })),
  );
}, 60_000);
afterAll(() => app?.close());

const ODD_STRINGS = [
  '',
  ' ',
  'NaN',
  'Infinity',
  '-Infinity',
  '1e309',
  '-1',
  '0',
  '1.5',
  '9007199254740993',
  'null',
  'undefined',
  'true',
  '[]',
  '{}',
  '\u0000',
  '\uFFFF',
  '\u202E',
  'ü',
  '💥',
  '👩‍🔧'.repeat(40),
  "'; drop table users; --",
  '<script>alert(1)</script>',
  '../../etc/passwd',
  'x'.repeat(5_000),
];

const oddString = fc.oneof(fc.constantFrom(...ODD_STRINGS), fc.string({ unit: 'grapheme', maxLength: 24 }));

const oddValue: fc.Arbitrary<unknown> = fc.oneof(
  oddString,
  fc.constantFrom(1e308, -1e308, 2 ** 53 + 1, -0, 0, -1, 1.5, 1e-320, null, true, false, [], {}),
  fc.integer(),
  fc.double(),
  fc.jsonValue({ maxDepth: 3 }),
);

// Field names the routes read, given values of the wrong kind (never a valid combination).
const FIELDS = [
  'email',
  'password',
  'role',
  'document',
  'token',
  'name',
  'samples',
  'designId',
  'plan',
  'seed',
  'settings',
  'archived',
  'workspaceId',
  'message',
  'analyses',
  'revision',
  'chunkSize',
  '__proto__',
  'constructor',
];
const wrongField = fc.oneof(
  fc.constantFrom(1e308, -1, NaN, 'NaN', 'Infinity', [], {}, null, true, '', 'x'.repeat(5_000), '💥'),
  fc.jsonValue({ maxDepth: 2 }).filter((v) => typeof v !== 'string'),
);

const nested = (depth: number): string => '['.repeat(depth) + ']'.repeat(depth);
const nestedObject = (depth: number): string => '{"a":'.repeat(depth) + '1' + '}'.repeat(depth);

/** A body and its content type. */
const bodyArb: fc.Arbitrary<{ contentType: string | null; body: string | null }> = fc.oneof(
  {
    weight: 6,
    arbitrary: fc.dictionary(fc.constantFrom(...FIELDS), wrongField, { maxKeys: 5 }).map((o) => json(o)),
  },
  { weight: 3, arbitrary: fc.jsonValue({ maxDepth: 4 }).map((v) => json(v)) },
  { weight: 2, arbitrary: oddValue.map((v) => json({ value: v, document: v, samples: v })) },
  {
    weight: 3,
    arbitrary: fc
      .constantFrom(
        '{',
        '{"email":',
        '[1,]',
        'nul',
        "{'a':1}",
        '\u0000',
        '\uFEFF{}',
        '{"a":1}}',
        '01',
        '"',
        '{"a":NaN}',
        '{"a":Infinity}',
      )
      .map((body) => ({ contentType: 'application/json', body })),
  },
  {
    weight: 2,
    arbitrary: fc
      .constantFrom(nested(100), nested(5_000), nested(100_000), nestedObject(1_000), nestedObject(20_000))
      .map((body) => ({ contentType: 'application/json', body })),
  },
  {
    weight: 2,
    arbitrary: fc
      .constantFrom(
        'text/plain',
        'application/x-www-form-urlencoded',
        'multipart/form-data; boundary=x',
        'application/xml',
        'application/json; charset=utf-7',
        'application/jsonx',
        'image/png',
      )
      .map((contentType) => ({ contentType, body: 'email=a%40b.example&role=admin' })),
  },
  { weight: 1, arbitrary: fc.constant({ contentType: null, body: '{"email":"a@b.example"}' }) },
  {
    weight: 1,
    arbitrary: fc.constant({
      contentType: 'application/json',
      body: json({ notes: 'x'.repeat(2_100_000) }).body,
    }),
  },
  { weight: 1, arbitrary: fc.constant({ contentType: null, body: null }) },
);

function json(v: unknown): { contentType: string; body: string } {
  return { contentType: 'application/json', body: JSON.stringify(v) ?? 'null' };
}

const JUNK_IDS = [
  'not-an-id',
  '12345',
  '0',
  '-1',
  '1e309',
  'NaN',
  'null',
  '%00',
  '%20',
  '..%2F..%2Fetc',
  '%E2%80%AE',
  '%F0%9F%92%A5',
  '%C0%AF',
  '%',
  'a'.repeat(300),
  '00000000-0000-0000-0000-000000000000',
  'ffffffff-ffff-ffff-ffff-ffffffffffff',
  '00000000-0000-4000-8000-00000000000G',
];

/** A path parameter: junk, a random UUID, or a real id of the other workspace (B). */
function idArb(): fc.Arbitrary<string> {
  return fc.oneof(
    fc.constantFrom(...JUNK_IDS),
    fc.uuid(),
    fc.constantFrom(b.designId, b.runId, b.team.engineer.id, b.inviteId, b.mailId),
    fc.string({ unit: 'grapheme', maxLength: 12 }).map((s) => encodeURIComponent(s) || 'x'),
  );
}

const QUERY_KEYS = [
  'q',
  'archived',
  'limit',
  'before',
  'to',
  'designId',
  'status',
  'action',
  'rev',
  'offset',
];
const queryArb = fc.option(fc.dictionary(fc.constantFrom(...QUERY_KEYS), oddString, { maxKeys: 3 }), {
  freq: 2,
});

function requestArb(): fc.Arbitrary<Sent> {
  return fc
    .record({
      op: fc.constantFrom(...ops),
      who: fc.constantFrom<Who>('anonymous', ...ROLES),
      ids: fc.array(idArb(), { minLength: 2, maxLength: 2 }),
      query: queryArb,
      body: bodyArb,
    })
    .filter(({ op, who }) => !(op.pattern === '/api/auth/logout' && who !== 'anonymous'))
    .map(({ op, who, ids, query, body }) => {
      let i = 0;
      const path = op.pattern.replace(/\{[A-Za-z]+\}/g, () => ids[i++ % ids.length]!);
      const qs = query ? new URLSearchParams(query).toString() : '';
      const hasBody = op.method !== 'GET';
      return {
        op,
        who,
        url: path + (qs ? `?${qs}` : ''),
        contentType: hasBody ? body.contentType : null,
        body: hasBody ? body.body : null,
      };
    });
}

const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

describe('API fuzz', () => {
  it('2,500 bad or odd requests over every route, every role and signed out: no 5xx, 4xx JSON errors, no change on refusal', async () => {
    const failures: string[] = [];
    const statuses = new Map<number, number>();
    let sent = 0;
    const routesHit = new Set<string>();
    await fc.assert(
      fc.asyncProperty(requestArb(), async (req) => {
        const checkState = STATE_CHANGING.has(req.op.method);
        const before = checkState ? await workspaceSnapshot(app.deps.db, [a.workspaceId, b.workspaceId]) : '';
        const headers: Record<string, string> = {};
        if (cookies[req.who]) headers.cookie = cookies[req.who]!;
        if (req.contentType) headers['content-type'] = req.contentType;
        const res = await fetch(app.baseUrl + req.url, {
          method: req.op.method,
          headers,
          body: req.body ?? undefined,
          redirect: 'manual',
        });
        const text = await res.text();
        sent++;
        routesHit.add(`${req.op.method} ${req.op.pattern}`);
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        const where = `${req.op.method} ${req.url.slice(0, 120)} as ${req.who} (${req.contentType}, ${String(req.body).slice(0, 80)})`;
        if (res.status >= 500) failures.push(`${res.status} ${where}: ${text.slice(0, 200)}`);
        if (res.status >= 400) {
          let message: unknown;
          try {
            message = (JSON.parse(text) as { error?: { message?: unknown } }).error?.message;
          } catch {
            message = undefined;
          }
          if (
            !/application\/json/.test(res.headers.get('content-type') ?? '') ||
            typeof message !== 'string' ||
            !message
          ) {
            failures.push(`${res.status} without a JSON error message: ${where}: ${text.slice(0, 200)}`);
          }
          if (checkState) {
            const after = await workspaceSnapshot(app.deps.db, [a.workspaceId, b.workspaceId]);
            if (after !== before) failures.push(`${res.status} but the data changed: ${where}`);
          }
        }
      }),
      { seed: 20261203, numRuns: 2_500, endOnFailure: true },
    );
    expect(failures).toEqual([]);
    expect(sent).toBeGreaterThanOrEqual(1_000);
    expect(statuses.get(500) ?? 0).toBe(0);
    expect(routesHit.size).toBe(ops.length);
    // The roles were still signed in at the end: the fuzz really ran as them.
    for (const role of ROLES) expect((await a.clients[role].get('/api/auth/me')).status, role).toBe(200);
    console.info(
      `API fuzz: ${sent} requests over ${routesHit.size} routes; statuses ${JSON.stringify(Object.fromEntries([...statuses].sort()))}`,
    );
  }, 240_000);
});
