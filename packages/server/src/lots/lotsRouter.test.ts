import { DESIGN_VERSION, MAX_LOT_BYTES, MAX_LOT_ROWS, parseDesign, sampleRows } from '@sigmatail/engine';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTeam, buildUser, type BuiltUser } from '../testing/buildUser.js';
import { signIn } from '../testing/signIn.js';
import { startTestApp, type TestApp } from '../testing/startTestApp.js';
import type { TestClient } from '../testing/testClient.js';
import { uploadLot } from '../testing/uploadLot.js';
import { exampleDesign } from '../runs/testing/exampleDesign.js';

let app: TestApp;
let team: Record<'admin' | 'engineer' | 'production' | 'viewer', BuiltUser>;
let production: TestClient;
let engineer: TestClient;
let viewer: TestClient;
let stranger: TestClient;
let designId: string;

const upload = uploadLot;

/** A seeded-looking resistor lot: 200 values around 470 Ω, deterministic. */
const RK_VALUES = Array.from(
  { length: 200 },
  (_, i) => 470 * (1 + 0.01 * Math.sin(i * 1.7) + 0.004 * Math.cos(i * 0.31)),
);
const RK_CSV = 'serial,value\n' + RK_VALUES.map((v, i) => `${i + 1},${v.toFixed(3)}`).join('\n') + '\n';

beforeAll(async () => {
  app = await startTestApp();
  team = await buildTeam(app.deps.db);
  production = await signIn(app, team.production);
  engineer = await signIn(app, team.engineer);
  viewer = await signIn(app, team.viewer);
  stranger = await signIn(app, await buildUser(app.deps.db, { role: 'admin' }));
  const created = await engineer.post('/api/designs', { document: exampleDesign() });
  designId = created.body.design.id;
});
afterAll(() => app?.close());

const lotCount = async () =>
  Number(
    (
      await app.deps.db
        .selectFrom('lots')
        .select((eb) => eb.fn.countAll().as('n'))
        .where('workspace_id', '=', team.production.workspaceId)
        .executeTakeFirstOrThrow()
    ).n,
  );

describe('lots API', () => {
  it('stores a resistor lot with its statistics, audited, readable by a viewer', async () => {
    const res = await upload(production, { name: 'Rk incoming', kind: 'resistor' }, RK_CSV);
    expect(res.status).toBe(201);
    const lot = res.body.lot;
    expect(lot).toMatchObject({ name: 'Rk incoming', kind: 'resistor', quantity: 'ohms', count: 200 });
    const s = lot.quantities[0].summary;
    expect(s.count).toBe(200);
    expect(s.mean).toBeCloseTo(RK_VALUES.reduce((a, b) => a + b) / 200, 2);
    expect(s.fits.map((f: { dist: string }) => f.dist)).toEqual(['normal', 'lognormal']);
    const read = await viewer.get(`/api/lots/${lot.id}`);
    expect(read.status).toBe(200);
    expect((await viewer.get('/api/lots')).body.lots.some((l: { id: string }) => l.id === lot.id)).toBe(true);
    const audit = await app.deps.db
      .selectFrom('audit_events')
      .select('action')
      .where('target', '=', lot.id)
      .execute();
    expect(audit.map((a) => a.action)).toEqual(['lot.upload']);
  });

  it('accepts RKM codes in a resistor lot', async () => {
    const res = await upload(
      production,
      { name: 'RKM lot', kind: 'resistor' },
      'value\n4k7\n4K68\n4.72k\n4700\n',
    );
    expect(res.status).toBe(201);
    expect(res.body.lot.quantities[0].summary.min).toBe(4680);
  });

  it('refuses a malformed file with row-level errors and stores nothing', async () => {
    const before = await lotCount();
    const csv = 'value\n470\nfour hundred\n-3\n\n471\n4x7\n';
    const res = await upload(production, { name: 'Bad lot', kind: 'resistor' }, csv);
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('file');
    expect(res.body.error.message).toMatch(/3 problems; nothing was stored/);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toEqual([
      'rows.3.value',
      'rows.4.value',
      'rows.7.value',
    ]);
    expect(await lotCount()).toBe(before);
  });

  it('says which column a tube lot lacks, and stores a good tube lot with its section correlation', async () => {
    const missing = await upload(
      production,
      { name: 'Tubes', kind: 'tube', quantity: 'ia-gm', tubeType: '12AX7' },
      'ia1,gm1,ia2\n1,1.6,1\n',
    );
    expect(missing.status).toBe(400);
    expect(missing.body.error.issues[0]).toMatchObject({ path: 'rows.1.gm2' });
    // At a fixed bias a perveance change scales Ia and gm alike; section 2 follows section 1 within 2 %.
    const rows = Array.from({ length: 40 }, (_, i) => {
      const c1 = 1 + 0.1 * Math.sin(i);
      const c2 = c1 * (1 + 0.02 * Math.cos(3 * i));
      return [1.2 * c1, 1.6 * c1, 1.2 * c2, 1.6 * c2].map((v) => v.toFixed(5)).join(',');
    });
    const ok = await upload(
      production,
      { name: '12AX7 lot', kind: 'tube', quantity: 'ia-gm', tubeType: '12AX7', va: '250', vg: '-2' },
      'ia1,gm1,ia2,gm2\n' + rows.join('\n'),
    );
    expect(ok.status).toBe(201);
    expect(ok.body.lot).toMatchObject({ kind: 'tube', quantity: 'ia-gm', tubeType: '12AX7', count: 40 });
    expect(ok.body.lot.testPoint).toEqual({ va: 250, vg: -2 });
    expect(ok.body.lot.sectionCorrelation).toBeGreaterThan(0.9);
    // Apply to the design's tubes: a new revision carrying the whole tubes.
    const applied = await production.post(`/api/lots/${ok.body.lot.id}/apply`, { designId, target: 'tube' });
    expect(applied.status).toBe(201);
    // Datasheet-typical sections sit far from where the catalog model runs at 250 V / −2 V.
    expect(applied.body.warnings.join(' ')).toMatch(/catalog model's/);
    const rev = await production.get(`/api/designs/${designId}/revisions/${applied.body.rev}`);
    expect(rev.body.revision.document.tube.spread.lot.tubes).toHaveLength(40);
    expect(rev.body.revision.document.version).toBe(DESIGN_VERSION); // stored in the current format
  });

  it('answers bad uploads with 4xx naming the field', async () => {
    const json = await production.post('/api/lots', { name: 'x', kind: 'resistor' });
    expect(json.status).toBe(415);
    expect(json.body.error.field).toBe('file');
    const noFile = await upload(production, { name: 'x', kind: 'resistor' });
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.field).toBe('file');
    const wrongField = await upload(production, { name: 'x', kind: 'resistor' }, RK_CSV, 'data');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.field).toBe('file');
    const big = await upload(
      production,
      { name: 'x', kind: 'resistor' },
      Buffer.alloc(MAX_LOT_BYTES + 10, 'a'),
    );
    expect(big.status).toBe(413);
    expect(big.body.error.field).toBe('file');
    const many = await upload(
      production,
      { name: 'x', kind: 'resistor' },
      'value\n' + '1\n'.repeat(MAX_LOT_ROWS + 1),
    );
    expect(many.status).toBe(400);
    expect(many.body.error.issues[0].message).toMatch(/more than/);
    const kind = await upload(production, { name: 'x', kind: 'capacitor' }, RK_CSV);
    expect(kind.status).toBe(400);
    expect(kind.body.error.field).toBe('kind');
    const name = await upload(production, { name: '', kind: 'resistor' }, RK_CSV);
    expect(name.body.error.field).toBe('name');
    const tube = await upload(
      production,
      { name: 'x', kind: 'tube', quantity: 'ia-gm', tubeType: '6L6' },
      RK_CSV,
    );
    expect(tube.body.error.field).toBe('tubeType');
    const notCsv = await upload(production, { name: 'x', kind: 'resistor' }, 'value\n"470\n');
    expect(notCsv.status).toBe(400);
    expect(notCsv.body.error.issues[0].message).toMatch(/CSV/);
  });

  it('lets a viewer read but not upload, delete or apply', async () => {
    expect((await upload(viewer, { name: 'x', kind: 'resistor' }, RK_CSV)).status).toBe(403);
    const lot = (await upload(production, { name: 'v', kind: 'resistor' }, RK_CSV)).body.lot;
    expect((await viewer.delete(`/api/lots/${lot.id}`)).status).toBe(403);
    expect((await viewer.post(`/api/lots/${lot.id}/apply`, { designId, target: 'rk' })).status).toBe(403);
  });

  it('keeps workspaces apart: another workspace gets 404 for a guessed id', async () => {
    const lot = (await upload(production, { name: 'mine', kind: 'resistor' }, RK_CSV)).body.lot;
    expect((await stranger.get(`/api/lots/${lot.id}`)).status).toBe(404);
    expect((await stranger.delete(`/api/lots/${lot.id}`)).status).toBe(404);
    expect((await stranger.post(`/api/lots/${lot.id}/apply`, { designId, target: 'rk' })).status).toBe(404);
    expect((await stranger.get('/api/lots')).body.lots).toEqual([]);
    // Nor can a lot be applied to another workspace's design.
    const theirs = (await upload(stranger, { name: 'theirs', kind: 'resistor' }, RK_CSV)).body.lot;
    const cross = await stranger.post(`/api/lots/${theirs.id}/apply`, { designId, target: 'rk' });
    expect(cross.status).toBe(404);
    expect(cross.body.error.field).toBe('designId');
  });

  it('applies a resistor lot as the part spread: a run of the revision matches the lot (MC error)', async () => {
    const lot = (await upload(production, { name: 'Rk lot', kind: 'resistor' }, RK_CSV)).body.lot;
    const bad = await production.post(`/api/lots/${lot.id}/apply`, { designId, target: 'tube' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('target');
    const res = await production.post(`/api/lots/${lot.id}/apply`, { designId, target: 'rk' });
    expect(res.status).toBe(201);
    expect(res.body.warnings).toEqual([]);
    // The wrong part: the lot is 470 Ω, Rt is 10 kΩ. Stored (the user chose it), with a warning.
    const wrong = await production.post(`/api/lots/${lot.id}/apply`, { designId, target: 'rt' });
    expect(wrong.status).toBe(201);
    expect(wrong.body.warnings[0]).toMatch(/95 % below rt's nominal 10 kΩ/);
    const doc = (await production.get(`/api/designs/${designId}/revisions/${res.body.rev}`)).body.revision
      .document;
    expect(doc.parts.rk.spread).toMatchObject({ kind: 'empirical', lot: { id: lot.id, name: 'Rk lot' } });
    const parsed = parseDesign(doc);
    if (!parsed.ok) throw new Error('applied design does not parse');
    const rows = sampleRows(
      parsed.design,
      { samples: 20_000, seed: 'apply', plan: 'random', chunkSize: 20_000 },
      0,
    );
    const i = rows.columns.indexOf('rk');
    const rk = [...rows.rows].map((r) => r[i]!);
    const mean = rk.reduce((a, b) => a + b) / rk.length;
    const sd = Math.sqrt(rk.reduce((a, b) => a + (b - mean) ** 2, 0) / (rk.length - 1));
    const s = lot.quantities[0].summary;
    expect(Math.abs(mean - s.mean)).toBeLessThan((4 * s.sd) / Math.sqrt(rk.length));
    expect(Math.abs(sd - s.sd)).toBeLessThan((4 * s.sd) / Math.sqrt(2 * rk.length));
    const audit = await app.deps.db
      .selectFrom('audit_events')
      .select('action')
      .where('target', '=', lot.id)
      .execute();
    expect(audit.map((a) => a.action).sort()).toEqual(['lot.apply', 'lot.apply', 'lot.upload']);
  });

  it('deletes a lot; designs keep their embedded values', async () => {
    const lot = (await upload(production, { name: 'gone', kind: 'resistor' }, RK_CSV)).body.lot;
    expect((await engineer.delete(`/api/lots/${lot.id}`)).status).toBe(204);
    expect((await engineer.get(`/api/lots/${lot.id}`)).status).toBe(404);
    expect((await engineer.delete(`/api/lots/${lot.id}`)).status).toBe(404);
  });
});
