import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseDesign } from './parseDesign.js';
import { designJsonSchema } from './designJsonSchema.js';
import { createStagePoint } from '../model/stagePoint.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const examples = readdirSync(`${root}examples`).filter((f) => f.endsWith('.json'));
// A design as loose JSON, so tests can break it in any way.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Doc = any;
const load = (f: string): Doc => JSON.parse(readFileSync(`${root}examples/${f}`, 'utf8'));
const guitar = () => load('guitar-12ax7-cap-coupled.json');

function errorsOf(mutate: (d: Doc) => void) {
  const d = guitar();
  mutate(d);
  const r = parseDesign(d);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.errors;
}

describe('parseDesign', () => {
  it.each(examples)('accepts the example %s and resolves part values to ohms', (f) => {
    const r = parseDesign(load(f));
    expect(r.ok).toBe(true);
    if (r.ok) for (const p of Object.values(r.design.parts)) expect(typeof p?.value).toBe('number');
  });

  it('resolves RKM and engineering text', () => {
    const r = parseDesign(guitar());
    if (!r.ok) throw new Error('example invalid');
    expect(r.design.parts.rl1.value).toBe(82000);
    expect(r.design.parts.rk.value).toBe(470);
    expect(r.design.parts.rg1.value).toBe(1e6);
  });

  it.each([
    ['negative resistance', (d: Doc) => (d.parts.rk.value = -470), 'parts.rk.value'],
    ['zero resistance', (d: Doc) => (d.parts.rt.value = 0), 'parts.rt.value'],
    ['unparseable value text', (d: Doc) => (d.parts.rl1.value = '82q'), 'parts.rl1.value'],
    ['tolerance of 100 %', (d: Doc) => (d.parts.rl1.tolerance = 100), 'parts.rl1.tolerance'],
    ['negative tolerance', (d: Doc) => (d.parts.rl1.tolerance = -1), 'parts.rl1.tolerance'],
    ['unknown tube type', (d: Doc) => (d.tube.type = '12XY7'), 'tube.type'],
    [
      'spread k beyond what the engine samples',
      (d: Doc) => (d.parts.rk.spread = { kind: 'normal', k: 20 }),
      'parts.rk.spread.k',
    ],
    ['NaN supply', (d: Doc) => (d.supply.bPlus = Number.NaN), 'supply.bPlus'],
    ['infinite value', (d: Doc) => (d.parts.rk.value = Infinity), 'parts.rk.value'],
    ['missing part', (d: Doc) => delete d.parts.rl2, 'parts.rl2'],
    ['a pair without RG2', (d: Doc) => delete d.parts.rg2, 'parts.rg2'],
    ['missing specs', (d: Doc) => delete d.specs, 'specs'],
    ['spec without limits', (d: Doc) => (d.specs = [{ metric: 'balanceDb' }]), 'specs.0.min'],
    ['unknown metric', (d: Doc) => (d.specs = [{ metric: 'loudness', max: 1 }]), 'specs.0.metric'],
    ['positive tail supply', (d: Doc) => (d.supply.tail = 50), 'supply.tail'],
    ['wrong format', (d: Doc) => (d.format = 'other'), 'format'],
    ['wrong version', (d: Doc) => (d.version = 3), 'version'],
    ['direct-coupled without drive', (d: Doc) => (d.topology = 'direct-coupled'), 'drive'],
    [
      'empty empirical lot',
      (d: Doc) => (d.parts.rk.spread = { kind: 'empirical', values: [] }),
      'parts.rk.spread.values',
    ],
    [
      'binned band wider than the tolerance',
      (d: Doc) => (d.parts.rk.spread = { kind: 'binned', inner: 5 }),
      'parts.rk.spread.inner',
    ],
    [
      'correlation above 1',
      (d: Doc) => (d.tube.spread.sectionCorrelation = 1.5),
      'tube.spread.sectionCorrelation',
    ],
  ])('rejects %s, naming the field', (_name, mutate, path) => {
    const errors = errorsOf(mutate);
    expect(errors.map((e) => e.path)).toContain(path);
    for (const e of errors) expect(e.message.length).toBeGreaterThan(0);
  });

  it('a split-load design may leave out RL2 and RG2; an older one that carries them reads as one without', () => {
    const lean = load('guitar-12au7-split-load.json');
    expect(lean.parts.rl2).toBeUndefined();
    const r = parseDesign(lean);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.design.parts.rl2).toBeUndefined();
    expect(r.design.parts.rg2).toBeUndefined();
    // As stored before they became optional: the unused parts present, same version.
    const part = (value: string) => ({ value, tolerance: 5, spread: { kind: 'normal' } });
    const older = {
      ...lean,
      parts: { ...lean.parts, rl2: part('22k'), rg2: part('1M'), cg2: { ...part('100n'), tolerance: 10 } },
    };
    const o = parseDesign(older);
    expect(o.ok).toBe(true);
    if (!o.ok) return;
    expect(o.design.version).toBe(2);
    // Dropped on reading: they sit in no node, so no run draws them and no plan prices them.
    expect(o.design.parts).toEqual(r.design.parts);
    const now = createStagePoint(r.design)();
    const then = createStagePoint(o.design)();
    for (const id of Object.keys(now)) expect(then[id]).toBe(now[id]);
  });

  it.each([null, undefined, 42, 'text', [], {}])('never throws on %j', (input) => {
    const r = parseDesign(input);
    expect(r.ok).toBe(false);
  });
});

describe('design.schema.json', () => {
  it('is up to date with the zod schema (regenerate: see README "Design format")', () => {
    const committed = JSON.parse(readFileSync(`${root}design.schema.json`, 'utf8'));
    expect(committed).toEqual(JSON.parse(JSON.stringify(designJsonSchema())));
  });
});
