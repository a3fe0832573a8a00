import { LOT_COLUMNS, TUBE_TYPES } from '@sigmatail/engine';
import { sql } from 'kysely';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTeam } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';

// Property-based fuzzing of the lot upload (POST /api/lots, multipart) as a signed-in production
// user: bad and odd CSV files, the file under another field name or as a text part, missing or
// wrong name/kind/quantity/tubeType/test point, oversized and unicode names, odd file types and
// names, non-multipart bodies and broken multipart. Expected: never a 5xx; every refusal a 4xx
// JSON error whose message names a field; and a refused upload stores nothing (the workspace's
// lots and lot.upload audit events are unchanged), an accepted one exactly one lot.

let app: TestApp;
let production: TestClient;
let workspaceId: string;

beforeAll(async () => {
  app = await startTestApp();
  const team = await buildTeam(app.deps.db);
  workspaceId = team.production.workspaceId;
  production = await signIn(app, team.production);
});
afterAll(() => app?.close());

/** Lots and upload audit events of the workspace: what a half-stored upload would change. */
async function stored(): Promise<string> {
  const { rows } = await sql<{ lots: string; audits: string }>`
    select (select count(*) from lots where workspace_id = ${workspaceId}) as lots,
           (select count(*) from audit_events where workspace_id = ${workspaceId} and action = 'lot.upload') as audits`.execute(
    app.deps.db,
  );
  return `${rows[0]!.lots}/${rows[0]!.audits}`;
}

const ODD = [
  '',
  ' ',
  'NaN',
  'Infinity',
  '-0',
  '1e309',
  '1e-310',
  '1.7e308',
  '-470',
  '4k7',
  '4K7',
  '4k7k',
  'k47',
  '0R',
  '\u0000',
  '💥',
  '\u202E',
  'a,b',
  'line\nbreak',
  '"',
  'x'.repeat(5_000),
];
const oddArb = fc.oneof(fc.constantFrom(...ODD), fc.string({ unit: 'grapheme', maxLength: 12 }));

const HEADERS = [
  'value',
  'VALUE',
  ' value ',
  'value,value',
  'serial,value,extra',
  'val',
  '',
  LOT_COLUMNS['ia-gm'].join(','),
  LOT_COLUMNS['mu-rp'].join(','),
  LOT_COLUMNS['mu-rp'].join(';'),
  'ia1,gm1,ia2',
  '\uFEFFvalue',
];

/** A file body: a header then odd rows, random bytes or unicode, or a fixed awkward case. */
const csvArb: fc.Arbitrary<string | Uint8Array> = fc.oneof(
  {
    weight: 6,
    arbitrary: fc
      .record({
        header: fc.constantFrom(...HEADERS),
        rows: fc.array(
          fc.array(fc.oneof(oddArb, fc.double({ min: 0.5, max: 1e5, noNaN: true }).map(String)), {
            minLength: 1,
            maxLength: 5,
          }),
          { maxLength: 12 },
        ),
        eol: fc.constantFrom('\n', '\r\n', '\r'),
        quote: fc.boolean(),
      })
      .map(({ header, rows, eol, quote }) =>
        [header, ...rows.map((r) => r.map((c) => (quote ? `"${c.replace(/"/g, '""')}"` : c)).join(','))].join(
          eol,
        ),
      ),
  },
  { weight: 1, arbitrary: fc.uint8Array({ maxLength: 600 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 300 }) },
  {
    weight: 1,
    arbitrary: fc.constantFrom(
      '',
      '\n\n\n',
      'value\n',
      'value\n"470\n',
      'value\n470,"a\nb",3\n',
      'value\n' + '9'.repeat(100_000) + '\n',
      'value;serial\n470;1\n',
    ),
  },
);

const nameArb = fc.oneof(
  fc.constantFrom(
    'Rk incoming',
    '',
    ' ',
    'x'.repeat(121),
    'x'.repeat(9_000),
    '\u0000',
    'Ω-lot ü 💥',
    '\u202Elot',
  ),
  fc.string({ unit: 'grapheme', maxLength: 130 }),
);

/** Form fields: each may be missing, right, or odd; or all right but the name or the test point. */
const fieldsArb: fc.Arbitrary<Record<string, string>> = fc.oneof(
  fc.record(
    {
      name: nameArb,
      kind: fc.oneof(fc.constantFrom('resistor', 'tube', 'tube', 'capacitor', 'Resistor', ''), oddArb),
      quantity: fc.oneof(fc.constantFrom('ia-gm', 'mu-rp', 'ohms', ''), oddArb),
      tubeType: fc.oneof(fc.constantFrom(...TUBE_TYPES, '6L6', '12ax7'), oddArb),
      va: oddArb,
      vg: oddArb,
    },
    { requiredKeys: [] },
  ),
  fc.record({ name: nameArb, kind: fc.constant('resistor') }),
  fc.record({
    name: fc.constant('Tubes'),
    kind: fc.constant('tube'),
    quantity: fc.constantFrom('ia-gm', 'mu-rp'),
    tubeType: fc.constantFrom(...TUBE_TYPES),
    va: fc.oneof(fc.constant('250'), oddArb),
    vg: fc.oneof(fc.constant('-2'), oddArb),
  }),
);

interface Upload {
  fields: Record<string, string>;
  csv: string | Uint8Array;
  /** How the file travels: as `file`, under another name, as a text part, twice, or not at all. */
  fileAs: 'file' | 'data' | 'File' | 'text' | 'twice' | 'none';
  fileType: string;
  fileName: string;
  /** A whole raw body instead of a FormData (wrong content types, broken multipart). */
  raw: { contentType: string; body: string } | null;
  extraFields: number;
}

const uploadArb: fc.Arbitrary<Upload> = fc.record({
  fields: fieldsArb,
  csv: csvArb,
  fileAs: fc.constantFrom('file', 'file', 'file', 'file', 'data', 'File', 'text', 'twice', 'none'),
  fileType: fc.constantFrom('text/csv', 'text/plain', 'application/octet-stream', 'image/png', ''),
  fileName: fc.oneof(
    fc.constantFrom('lot.csv', '', '../../etc/passwd', 'ü💥.csv', 'x'.repeat(400)),
    fc.string(),
  ),
  raw: fc.oneof(
    { weight: 6, arbitrary: fc.constant(null) },
    {
      weight: 1,
      arbitrary: fc.record({
        contentType: fc.constantFrom(
          'text/csv',
          'text/plain',
          'application/json',
          'application/x-www-form-urlencoded',
          'multipart/form-data',
          'multipart/form-data; boundary=zz',
          'multipart/mixed; boundary=zz',
        ),
        body: fc.constantFrom(
          'value\n470\n',
          '{"name":"x","kind":"resistor"}',
          'name=x&kind=resistor',
          '--zz\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\nvalue\n470\n',
          '--zz\r\nContent-Disposition: form-data; name="kind"\r\n\r\nresistor\r\n--zz--\r\n',
          '--zz--\r\n',
          '',
        ),
      }),
    },
  ),
  extraFields: fc.constantFrom(0, 0, 0, 3, 25),
});

async function send(u: Upload): Promise<Response> {
  const headers: Record<string, string> = production.cookie ? { cookie: production.cookie } : {};
  if (u.raw) {
    return fetch(`${app.baseUrl}/api/lots`, {
      method: 'POST',
      headers: { ...headers, 'content-type': u.raw.contentType },
      body: u.raw.body,
    });
  }
  const fd = new FormData();
  for (const [k, v] of Object.entries(u.fields)) fd.append(k, v);
  for (let i = 0; i < u.extraFields; i++) fd.append(i === 0 ? '__proto__' : `extra${i}`, 'x');
  const blob = () => new Blob([u.csv], { type: u.fileType });
  if (u.fileAs === 'file' || u.fileAs === 'twice') fd.append('file', blob(), u.fileName);
  if (u.fileAs === 'twice') fd.append('file', blob(), u.fileName);
  if (u.fileAs === 'data' || u.fileAs === 'File') fd.append(u.fileAs, blob(), u.fileName);
  if (u.fileAs === 'text') fd.append('file', typeof u.csv === 'string' ? u.csv : 'value\n470\n');
  return fetch(`${app.baseUrl}/api/lots`, { method: 'POST', headers, body: fd });
}

describe('lot upload fuzz', () => {
  it('400 bad or odd uploads: no 5xx, 4xx JSON errors naming a field, nothing stored on refusal', async () => {
    const failures: string[] = [];
    const statuses = new Map<number, number>();
    const fields = new Map<string, number>();
    let sent = 0;
    await fc.assert(
      fc.asyncProperty(uploadArb, async (u) => {
        const before = await stored();
        const res = await send(u);
        const text = await res.text();
        sent++;
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        const after = await stored();
        const where = `${JSON.stringify({ ...u, csv: String(u.csv).slice(0, 80) }).slice(0, 400)}`;
        if (res.status >= 500) failures.push(`${res.status} ${where}: ${text.slice(0, 200)}`);
        if (res.status === 201) {
          const [lots, audits] = before.split('/').map(Number);
          if (after !== `${lots! + 1}/${audits! + 1}`)
            failures.push(`201 but stored ${before} → ${after}: ${where}`);
          return;
        }
        if (after !== before) failures.push(`${res.status} but stored ${before} → ${after}: ${where}`);
        let error: { message?: unknown; field?: unknown } | undefined;
        try {
          error = (JSON.parse(text) as { error?: typeof error }).error;
        } catch {
          error = undefined;
        }
        const jsonType = /application\/json/.test(res.headers.get('content-type') ?? '');
        const message = typeof error?.message === 'string' ? error.message : '';
        const field = typeof error?.field === 'string' ? error.field : '';
        fields.set(field, (fields.get(field) ?? 0) + 1);
        if (res.status < 400 || !jsonType || !message || !field || !message.includes(field)) {
          failures.push(`${res.status} without a JSON error naming a field: ${where}: ${text.slice(0, 200)}`);
        }
      }),
      { seed: 20261207, numRuns: 400, endOnFailure: true },
    );
    expect(failures).toEqual([]);
    expect(sent).toBeGreaterThanOrEqual(300);
    expect([...statuses.keys()].filter((s) => s >= 500)).toEqual([]);
    // Still signed in at the end: the uploads really ran as the production user.
    expect((await production.get('/api/auth/me')).status).toBe(200);
    console.info(
      `lot upload fuzz: ${sent} uploads; statuses ${JSON.stringify(Object.fromEntries([...statuses].sort()))}; refusals by field ${JSON.stringify(Object.fromEntries(fields))}`,
    );
  }, 120_000);
});
