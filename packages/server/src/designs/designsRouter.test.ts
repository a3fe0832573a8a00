import { DEMO_DESIGNS } from '@sigmatail/db';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTeam, buildUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';

let app: TestApp;
let engineer: TestClient;
let viewer: TestClient;
let adminClient: TestClient;
let workspaceId: string;

const doc = (name: string, patch: Record<string, unknown> = {}) => ({
  ...structuredClone(DEMO_DESIGNS[0]!),
  name,
  ...patch,
});

beforeAll(async () => {
  app = await startTestApp();
  const team = await buildTeam(app.deps.db);
  workspaceId = team.engineer.workspaceId;
  engineer = await signIn(app, team.engineer);
  viewer = await signIn(app, team.viewer);
  adminClient = await signIn(app, team.admin);
});
afterAll(() => app?.close());

describe('designs', () => {
  it('creates a design as revision 1 and reads it back with its document as entered', async () => {
    const res = await engineer.post('/api/designs', {
      document: doc('Amp A splitter'),
      message: 'first cut',
    });
    expect(res.status).toBe(201);
    const d = res.body.design;
    expect(d).toMatchObject({ name: 'Amp A splitter', latestRev: 1, archivedAt: null });
    expect(d.latestRevision).toMatchObject({
      rev: 1,
      message: 'first cut',
      createdBy: { name: 'Fixture engineer' },
    });
    // Part values stay as entered (RKM text), not resolved to ohms.
    expect(d.latestRevision.document.parts.rl1.value).toBe('82k');
    const got = await viewer.get(`/api/designs/${d.id}`);
    expect(got.status).toBe(200);
    expect(got.body.design.latestRevision.document).toEqual(doc('Amp A splitter'));
  });

  it('saves every change as a new immutable revision', async () => {
    const { body } = await engineer.post('/api/designs', { document: doc('Amp B splitter') });
    const id = body.design.id as string;
    const rev2 = await engineer.post(`/api/designs/${id}/revisions`, {
      document: doc('Amp B splitter v2', { supply: { bPlus: 350, tail: 0 } }),
      message: 'more B+',
    });
    expect(rev2.status).toBe(201);
    expect(rev2.body.revision).toMatchObject({ rev: 2, message: 'more B+' });
    const list = await viewer.get(`/api/designs/${id}/revisions`);
    expect(list.body.revisions.map((r: { rev: number }) => r.rev)).toEqual([2, 1]);
    const r1 = await viewer.get(`/api/designs/${id}/revisions/1`);
    expect(r1.body.revision.document.supply.bPlus).toBe(330);
    const latest = await viewer.get(`/api/designs/${id}`);
    expect(latest.body.design).toMatchObject({ name: 'Amp B splitter v2', latestRev: 2 });
    // The database itself refuses to change a stored revision.
    await expect(
      sql`update design_revisions set message = 'edited' where design_id = ${id}`.execute(app.deps.db),
    ).rejects.toThrow(/immutable/);
  });

  it('numbers concurrent saves consecutively', async () => {
    const { body } = await engineer.post('/api/designs', { document: doc('Amp C splitter') });
    const id = body.design.id as string;
    const saves = await Promise.all(
      [1, 2, 3, 4].map((i) => engineer.post(`/api/designs/${id}/revisions`, { document: doc(`Amp C ${i}`) })),
    );
    expect(saves.map((s) => s.status)).toEqual([201, 201, 201, 201]);
    expect(saves.map((s) => s.body.revision.rev).sort()).toEqual([2, 3, 4, 5]);
  });

  it('lists with search and the archived filter', async () => {
    const tag = `Zq${Date.now()}`;
    const a = (await engineer.post('/api/designs', { document: doc(`${tag} bright`) })).body.design.id;
    const b = (await engineer.post('/api/designs', { document: doc(`${tag} dark`) })).body.design.id;
    const archived = await engineer.post(`/api/designs/${b}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body.design.archivedAt).not.toBeNull();
    const ids = async (query: string) =>
      (await viewer.get(`/api/designs?${query}`)).body.designs.map((d: { id: string }) => d.id);
    expect(await ids(`q=${tag}`)).toEqual([a]);
    expect(await ids(`q=${tag}&archived=only`)).toEqual([b]);
    expect((await ids(`q=${tag}&archived=include`)).sort()).toEqual([a, b].sort());
    expect(await ids(`q=${tag.toLowerCase()}%20BRIGHT`)).toEqual([a]);
    // Notes and tube type are searched too, JSON keys are not.
    const noted = (
      await engineer.post('/api/designs', { document: doc('Plain name', { notes: `${tag}-notes` }) })
    ).body.design.id;
    expect(await ids(`q=${tag}-notes`)).toEqual([noted]);
    expect(await ids(`q=${encodeURIComponent('"tolerance"')}`)).toEqual([]);
    const frozen = await engineer.post(`/api/designs/${b}/revisions`, { document: doc(`${tag} dark 2`) });
    expect(frozen.status).toBe(409);
    const restored = await engineer.post(`/api/designs/${b}/archive`, { archived: false });
    expect(restored.body.design.archivedAt).toBeNull();
    const bad = await viewer.get('/api/designs?archived=maybe');
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('archived');
  });

  it('lists each design with its topology, tube, B+ and its latest finished run at a glance', async () => {
    const tag = `glance-${Date.now()}`;
    const { body } = await engineer.post('/api/designs', { document: doc(`${tag} stage`) });
    const id = body.design.id as string;
    const find = async () =>
      ((await viewer.get(`/api/designs?q=${tag}`)).body.designs as Record<string, unknown>[]).find(
        (d) => d.id === id,
      )!;
    const demo = DEMO_DESIGNS[0] as { topology: string; tube: { type: string }; supply: { bPlus: number } };
    expect(await find()).toMatchObject({
      topology: demo.topology,
      tube: demo.tube.type,
      bPlus: demo.supply.bPlus,
      latestRun: null,
    });
    // Two finished runs and a failed later one: the list shows the latest finished run.
    const db = app.deps.db;
    const user = await db
      .selectFrom('designs')
      .select('created_by')
      .where('id', '=', id)
      .executeTakeFirstOrThrow();
    const addRun = async (status: 'done' | 'failed', finishedAt: string, jointYield: number | null) => {
      const run = await db
        .insertInto('runs')
        .values({
          workspace_id: workspaceId,
          design_id: id,
          revision: 1,
          created_by: user.created_by,
          samples: 20_000,
          seed: tag,
          plan: 'random',
          chunk_size: 10_000,
          analyses: '{}',
          design: '{}',
          engine_version: 'fixture',
          chunk_total: 3,
          status,
          finished_at: new Date(finishedAt),
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      if (status === 'done')
        await db
          .insertInto('run_results')
          .values({ run_id: run.id, results: '{}', valid_count: 20_000, joint_yield: jointYield })
          .execute();
      return run.id;
    };
    await addRun('done', '2026-01-01T10:00:00Z', 0.9);
    const latest = await addRun('done', '2026-01-02T10:00:00Z', 0.987);
    await addRun('failed', '2026-01-03T10:00:00Z', null);
    expect((await find()).latestRun).toEqual({
      id: latest,
      revision: 1,
      samples: 20_000,
      jointYield: 0.987,
      finishedAt: '2026-01-02T10:00:00.000Z',
    });
  });

  it('refuses an invalid document with 400 naming the field, and stores nothing', async () => {
    const count = async () =>
      Number(
        (
          await app.deps.db
            .selectFrom('designs')
            .select((eb) => eb.fn.countAll().as('n'))
            .where('workspace_id', '=', workspaceId)
            .executeTakeFirstOrThrow()
        ).n,
      );
    const before = await count();
    const bad = doc('Broken', {
      parts: {
        ...(DEMO_DESIGNS[0] as { parts: object }).parts,
        rk: { value: '4k7', tolerance: 150, spread: { kind: 'normal' } },
      },
    });
    const res = await engineer.post('/api/designs', { document: bad });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('document.parts.rk.tolerance');
    expect(res.body.error.issues.length).toBeGreaterThan(0);
    const missing = await engineer.post('/api/designs', {});
    expect(missing.status).toBe(400);
    expect(missing.body.error.field).toBe('document');
    expect(await count()).toBe(before);
  });

  it('answers 404 for unknown, malformed or other-workspace ids and revisions', async () => {
    const stranger = await buildUser(app.deps.db, { role: 'engineer' });
    const strangerClient = await signIn(app, stranger);
    const { body } = await engineer.post('/api/designs', { document: doc('Private splitter') });
    const id = body.design.id as string;
    expect((await strangerClient.get(`/api/designs/${id}`)).status).toBe(404);
    expect((await strangerClient.post(`/api/designs/${id}/revisions`, { document: doc('x') })).status).toBe(
      404,
    );
    expect((await viewer.get('/api/designs/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await viewer.get('/api/designs/42')).status).toBe(404);
    expect((await viewer.get(`/api/designs/${id}/revisions/7`)).status).toBe(404);
    expect((await viewer.get(`/api/designs/${id}/revisions/abc`)).status).toBe(404);
    expect((await viewer.get(`/api/designs/${id}/revisions/1e99`)).status).toBe(404);
  });

  it('records create, revise and archive in the audit trail', async () => {
    const { body } = await engineer.post('/api/designs', { document: doc('Audited splitter') });
    const id = body.design.id as string;
    await engineer.post(`/api/designs/${id}/revisions`, { document: doc('Audited splitter') });
    await engineer.post(`/api/designs/${id}/archive`);
    const events = (await adminClient.get('/api/audit')).body.events.filter(
      (e: { target: string }) => e.target === id,
    );
    expect(events.map((e: { action: string }) => e.action).sort()).toEqual([
      'design.archive',
      'design.create',
      'design.revise',
    ]);
  });
});
