import {
  chunkCount,
  mergeChunks,
  parseDesign,
  runChunk,
  runExtras,
  sampleRows,
  type RunPlan,
} from '@sigmatail/engine';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTeam, type BuiltUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import { TEST_DATABASE_URL } from '../testing/testDatabaseUrl.js';
import type { TestClient } from '../testing/testClient.js';
import { exampleDesign } from './testing/exampleDesign.js';
import { startTestWorker } from './testing/startTestWorker.js';
import { EXTRAS_TASKS } from './insertRunChunks.js';

let app: TestApp;
let team: Record<'admin' | 'engineer' | 'production' | 'viewer', BuiltUser>;
let engineer: TestClient;
let production: TestClient;
let viewer: TestClient;
let designId: string;
let worker: { stop(): Promise<void> } | undefined;

const SMALL = { samples: 3_000, plan: 'lhs', seed: 'bench-7', analyses: { varianceIndices: false } } as const;

beforeAll(async () => {
  process.env.SIGMATAIL_CHUNK_SIZE = '1000';
  app = await startTestApp();
  team = await buildTeam(app.deps.db);
  engineer = await signIn(app, team.engineer);
  production = await signIn(app, team.production);
  viewer = await signIn(app, team.viewer);
  const created = await engineer.post('/api/designs', { document: exampleDesign() });
  expect(created.status).toBe(201);
  designId = created.body.design.id;
});
afterAll(async () => {
  delete process.env.SIGMATAIL_CHUNK_SIZE;
  await worker?.stop();
  await app?.close();
});

async function waitDone(client: TestClient, id: string): Promise<Record<string, unknown>> {
  for (let i = 0; i < 600; i++) {
    const res = await client.get(`/api/runs/${id}`);
    if (['done', 'failed', 'cancelled'].includes(res.body.run.status)) return res.body.run;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('run did not finish');
}

describe('runs API', () => {
  it('rejects bad launches with the field named', async () => {
    const cases: [unknown, number, string][] = [
      [{ ...SMALL, designId, samples: 0 }, 400, 'samples'],
      [{ ...SMALL, designId, samples: 100_000_001 }, 400, 'samples'],
      [{ ...SMALL, designId, samples: 1.5 }, 400, 'samples'],
      [{ ...SMALL, designId, plan: 'grid' }, 400, 'plan'],
      [{ ...SMALL, designId, seed: '' }, 400, 'seed'],
      [{ ...SMALL, designId: 'nope' }, 400, 'designId'],
      [{ ...SMALL, designId, analyses: { sideways: true } }, 400, 'analyses'],
      [{ ...SMALL, designId, analyses: { largeSignal: 'yes' } }, 400, 'analyses.largeSignal'],
      [{ ...SMALL, designId, analyses: { largeSignalSamples: 31 } }, 400, 'analyses.largeSignalSamples'],
      [{ ...SMALL, designId, analyses: { largeSignalSamples: 513 } }, 400, 'analyses.largeSignalSamples'],
      [{ ...SMALL, designId, analyses: { largeSignalSamples: 40.5 } }, 400, 'analyses.largeSignalSamples'],
      [{ ...SMALL, designId: crypto.randomUUID() }, 404, 'designId'],
      [{ ...SMALL, designId, revision: 99 }, 404, 'revision'],
    ];
    for (const [body, status, field] of cases) {
      const res = await engineer.post('/api/runs', body);
      expect([res.status, res.body.error?.field], JSON.stringify(body)).toEqual([status, field]);
    }
    expect((await viewer.post('/api/runs', { ...SMALL, designId })).status).toBe(403);
  });

  it('refuses a revision the engine cannot set up, naming the part, before anything is queued', async () => {
    const doc = exampleDesign() as { parts: Record<string, unknown> };
    doc.parts.rt = { value: '10k', tolerance: 5, spread: { kind: 'normal', k: 20 } }; // k beyond what the engine samples
    // Saving such a design is refused now; a revision stored before that rule may still hold one.
    const refused = await engineer.post('/api/designs', { document: doc });
    expect(refused.status).toBe(400);
    const created = await engineer.post('/api/designs', { document: exampleDesign() });
    expect(created.status).toBe(201);
    await app.deps.db
      .insertInto('design_revisions')
      .values({
        design_id: created.body.design.id,
        rev: 2,
        document: JSON.stringify(doc),
        message: 'stored before the k limit',
        created_by: team.engineer.id,
      })
      .execute();
    const res = await engineer.post('/api/runs', { ...SMALL, designId: created.body.design.id, revision: 2 });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('revision');
    expect(res.body.error.message).toMatch(/parts\.rt\.spread\.k/);
    const runs = await engineer.get(`/api/runs?designId=${created.body.design.id}`);
    expect(runs.body.runs).toEqual([]);
  });

  it('launches, reports progress, stores results equal to the engine run directly, and exports', async () => {
    const launched = await production.post('/api/runs', { ...SMALL, designId });
    expect(launched.status).toBe(202);
    const id = launched.body.id as string;
    const queued = await engineer.get(`/api/runs/${id}`);
    expect(queued.body.run).toMatchObject({
      status: 'queued',
      samples: 3_000,
      seed: 'bench-7',
      plan: 'lhs',
      revision: 1,
    });
    const total = 3 + EXTRAS_TASKS; // 3 chunks + the once-per-run parts
    expect(queued.body.run.progress).toEqual({ done: 0, total, fraction: 0 });
    expect((await viewer.get(`/api/runs/${id}/results`)).status).toBe(409);

    worker = startTestWorker(app.deps.db, TEST_DATABASE_URL);
    const run = await waitDone(viewer, id);
    expect(run).toMatchObject({ status: 'done', progress: { done: total, total, fraction: 1 } });

    // The same run computed by calling the engine directly, without queue, pool or database.
    const parsed = parseDesign(exampleDesign());
    if (!parsed.ok) throw new Error('example design does not parse');
    const plan: RunPlan = { ...SMALL, chunkSize: 1000 };
    const chunks = Array.from({ length: chunkCount(plan) }, (_, k) => runChunk(parsed.design, plan, k));
    const direct = mergeChunks(parsed.design, plan, chunks, runExtras(parsed.design, plan));
    const results = await viewer.get(`/api/runs/${id}/results`);
    expect(results.status).toBe(200);
    // Compared as text (not toEqual) so a difference in the last bit of any number fails too.
    const same = JSON.stringify(results.body.results) === JSON.stringify(direct);
    expect(same, 'stored results differ from the engine run directly').toBe(true);
    expect(results.body.run.summary.jointYield).toBe(direct.joint.yield);

    const json = await production.get(`/api/runs/${id}/export.json`);
    expect(json.headers.get('content-disposition')).toMatch(
      /attachment; filename="?sigmatail-run-[0-9a-f-]+\.json"?/,
    );
    expect(json.body.results).toEqual(results.body.results);
    expect((await viewer.get(`/api/runs/${id}/export.json`)).status).toBe(403);

    const csv = await engineer.get(`/api/runs/${id}/export.csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers.get('content-type')).toMatch(/text\/csv/);
    const lines = (csv.body as string).trimEnd().split('\n');
    expect(lines).toHaveLength(3_001);
    const first = sampleRows(parsed.design, plan, 0);
    expect(lines[0]).toBe(first.columns.join(','));
    const row0 = [...first.rows][0]!;
    expect(lines[1]!.split(',').map((c) => (c === '' ? NaN : Number(c)))).toEqual(row0);
    const last = [...sampleRows(parsed.design, plan, 2).rows].at(-1)!;
    expect(lines[3_000]!.split(',').map((c) => (c === '' ? NaN : Number(c)))).toEqual(last);

    // The scatter preview: the same rows as the export's head, for a viewer too, never audited.
    const preview = await viewer.get(`/api/runs/${id}/samples?limit=1500`);
    expect(preview.status).toBe(200);
    expect(preview.body.columns).toEqual(first.columns);
    expect(preview.body.rows).toHaveLength(1_500);
    const asNumbers = (r: (number | null)[]) => r.map((x) => (x === null ? NaN : x));
    expect(asNumbers(preview.body.rows[0])).toEqual(row0);
    expect(asNumbers(preview.body.rows[1_499])).toEqual([...sampleRows(parsed.design, plan, 1).rows][499]);
    const tooMany = await viewer.get(`/api/runs/${id}/samples?limit=10001`);
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.field).toBe('limit');
    expect((await viewer.get(`/api/runs/${id}/samples?rows=5`)).status).toBe(400);

    const audit = await app.deps.db
      .selectFrom('audit_events')
      .select(['action', 'detail'])
      .where('target', '=', id)
      .orderBy('at')
      .execute();
    expect(audit.map((a) => a.action)).toEqual(['run.launch', 'run.export', 'run.export']);
  });

  it('draws a seed when none is given and stores it', async () => {
    const { seed: _seed, ...noSeed } = SMALL;
    const res = await engineer.post('/api/runs', { ...noSeed, designId, samples: 10 });
    const run = (await engineer.get(`/api/runs/${res.body.id}`)).body.run;
    expect(run.seed).toMatch(/^[0-9a-f]{16}$/);
    await waitDone(engineer, res.body.id);
  });

  it('adds the per-sample large-signal figures when asked, equal to the engine run directly', async () => {
    const body = {
      ...SMALL,
      samples: 100,
      analyses: { ...SMALL.analyses, largeSignal: true, largeSignalSamples: 40 },
    };
    const res = await production.post('/api/runs', { ...body, designId });
    expect(res.status).toBe(202);
    const run = await waitDone(viewer, res.body.id);
    expect(run).toMatchObject({
      status: 'done',
      analyses: { varianceIndices: false, largeSignal: true, largeSignalSamples: 40 },
    });
    const parsed = parseDesign(exampleDesign());
    if (!parsed.ok) throw new Error('example design does not parse');
    const expected = runExtras(parsed.design, { ...body, chunkSize: 1000 }).largeSignal;
    const results = (await viewer.get(`/api/runs/${res.body.id}/results`)).body.results;
    expect(results.largeSignal.subsample).toBe(40);
    expect(results.largeSignal).toEqual(JSON.parse(JSON.stringify(expected)));
  });

  it('cancels an active run once, and lists runs with filters', async () => {
    const res = await engineer.post('/api/runs', { ...SMALL, designId, samples: 5_000_000 });
    const id = res.body.id as string;
    expect((await viewer.post(`/api/runs/${id}/cancel`)).status).toBe(403);
    const cancelled = await production.post(`/api/runs/${id}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body.run.status).toBe('cancelled');
    expect(cancelled.body.run.finishedAt).not.toBeNull();
    const again = await production.post(`/api/runs/${id}/cancel`);
    expect(again.status).toBe(409);

    const list = await viewer.get(`/api/runs?designId=${designId}&status=cancelled`);
    expect(list.status).toBe(200);
    expect(list.body.runs.map((r: { id: string }) => r.id)).toEqual([id]);
    const unfiltered = await viewer.get(`/api/runs?designId=${designId}&status=&limit=`);
    expect(unfiltered.body.runs.length).toBeGreaterThan(1);
    const limited = await viewer.get(`/api/runs?designId=${designId}&limit=1`);
    expect(limited.body.runs).toHaveLength(1);
    expect((await viewer.get('/api/runs?status=finished')).body.error.field).toBe('status');
    expect((await viewer.get('/api/runs?limit=0')).body.error.field).toBe('limit');

    const actions = await app.deps.db
      .selectFrom('audit_events')
      .select('action')
      .where('target', '=', id)
      .execute();
    expect(actions.map((a) => a.action).sort()).toEqual(['run.cancel', 'run.launch']);
    // Admins read them through the audit API.
    const admin = await signIn(app, team.admin);
    const listed = await admin.get('/api/audit?action=run.cancel');
    expect(listed.status).toBe(200);
    expect(listed.body.events.map((e: { target: string }) => e.target)).toContain(id);
  });

  it('keeps runs of other workspaces invisible', async () => {
    const stranger = await buildTeam(app.deps.db);
    const other = await signIn(app, stranger.admin);
    const mine = (await engineer.get('/api/runs')).body.runs as { id: string }[];
    expect(mine.length).toBeGreaterThan(0);
    expect((await other.get(`/api/runs/${mine[0]!.id}`)).status).toBe(404);
    expect((await other.get(`/api/runs/${mine[0]!.id}/samples`)).status).toBe(404);
    expect((await other.get('/api/runs')).body.runs).toEqual([]);
    expect((await other.post('/api/runs', { ...SMALL, designId })).status).toBe(404);
  });
});
