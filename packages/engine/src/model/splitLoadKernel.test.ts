import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parseDesign } from '../design/parseDesign.js';
import type { ResolvedDesign } from '../design/designSchema.js';
import { korenCurrent } from '../tubes/korenTriode.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import { mergeChunks, runChunk } from '../run/runApi.js';
import { chunkCount, type RunPlan } from '../run/runPlan.js';
import { createStagePoint } from './stagePoint.js';
import { nominalResults } from './nominalResults.js';
import { SPLIT_LOAD_NAN_METRICS } from './splitLoadKernel.js';

const root = fileURLToPath(new URL('../../', import.meta.url));

function example(): ResolvedDesign {
  const r = parseDesign(JSON.parse(readFileSync(`${root}examples/guitar-12au7-split-load.json`, 'utf8')));
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

/**
 * The nominal point worked out here independently: the DC equation by bisection, gm and rp by
 * central differences of the Koren current, then the textbook gains with the loads and the
 * bootstrapped grid leak reduced by hand (common practice, no source).
 */
function handWorked(d: ResolvedDesign) {
  const tube = TUBE_CATALOG[d.tube.type].model;
  const p = d.parts;
  const [rl, rb, rt, rg] = [p.rl1.value, p.rk.value, p.rt.value, p.rg1.value];
  const [rload1, rload2, rs] = [p.rload1!.value, p.rload2!.value, p.rsource!.value];
  const bPlus = d.supply.bPlus;
  const f = (ia: number) => ia - korenCurrent(tube, bPlus - ia * (rl + rb + rt), -ia * rb);
  let lo = 0;
  let hi = bPlus / (rl + rb + rt);
  for (let k = 0; k < 200; k++) {
    const m = 0.5 * (lo + hi);
    if (f(m) > 0) hi = m;
    else lo = m;
  }
  const ia = 0.5 * (lo + hi);
  const vpk = bPlus - ia * (rl + rb + rt);
  const h = 1e-4;
  const gm = (korenCurrent(tube, vpk, -ia * rb + h) - korenCurrent(tube, vpk, -ia * rb - h)) / (2 * h);
  const ga = (korenCurrent(tube, vpk + h, -ia * rb) - korenCurrent(tube, vpk - h, -ia * rb)) / (2 * h);
  const rp = 1 / ga;
  const mu = gm * rp;
  // Grid leak to J: the cathode circuit is a source a·vg behind Rb + Rt∥RG; then Rload2 across it.
  const par = (x: number, y: number) => (x * y) / (x + y);
  const rkn = rb + par(rt, rg);
  const rke = par(rkn, rload2);
  const vth = (rt / (rt + rg)) * (rke / rkn);
  const rle = par(rl, rload1);
  const i = (mu - (mu + 1) * vth) / (rp + rle + (mu + 1) * rke);
  const ap = -rle * i;
  const ak = vth + rke * i;
  const vj = (ak / rb + 1 / rg) / (1 / rb + 1 / rg + 1 / rt);
  const zin = rg / (1 - vj);
  const src = zin / (zin + rs);
  return {
    ia,
    vk: ia * (rb + rt),
    a11: ap * src,
    a12: ak * src,
    zout1: par(rl, rp + (mu + 1) * rke),
    zout2: par(rkn, (rp + rle) / (mu + 1)),
  };
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('split-load stage kernel', () => {
  it('nominal metrics equal the hand-worked closed form; one-section metrics are NaN', () => {
    const d = example();
    const at = createStagePoint(d)();
    const ref = handWorked(d);
    expect(rel(at.ia1, ref.ia)).toBeLessThan(1e-9);
    expect(rel(at.vk, ref.vk)).toBeLessThan(1e-9);
    // gm and rp by differences: good to ~1e-7, so the small signal agrees to 1e-6.
    for (const k of ['a11', 'a12', 'zout1', 'zout2'] as const) expect(rel(at[k], ref[k])).toBeLessThan(1e-6);
    expect(at.balanceDb).toBeCloseTo(20 * Math.log10(Math.abs(ref.a12 / ref.a11)), 5);
    expect(at.pd1).toBeCloseTo(at.ia1 * (at.va1 - at.vk), 12);
    for (const id of SPLIT_LOAD_NAN_METRICS) expect(Number.isNaN(at[id])).toBe(true);
    expect(at.valid).toBe(1);
    // Plausible for a 12AU7 cathodyne at 300 V: both gains a little below one, plate Zout near RL.
    expect(at.a11).toBeGreaterThan(-1);
    expect(at.a11).toBeLessThan(-0.75);
    expect(at.a12).toBeGreaterThan(0.75);
    expect(at.a12).toBeLessThan(1);
    expect(at.zout2).toBeLessThan(at.zout1 / 5);
  });

  it('nominalResults reports the one section, with no RL2 trim', () => {
    const r = nominalResults(example());
    expect(r.status).toBe('ok');
    expect(r.trim).toBeUndefined();
    expect(Number.isNaN(r.metrics.a21)).toBe(true);
    expect(r.warnings).toEqual([]);
  });

  it('a run through runChunk/mergeChunks: every sample biased, sensible yield, nominal as the closed form', () => {
    const d = example();
    const plan: RunPlan = { samples: 12_000, seed: 'cathodyne', plan: 'lhs', chunkSize: 4096 };
    const chunks = Array.from({ length: chunkCount(plan) }, (_v, k) => runChunk(d, plan, k));
    const r = mergeChunks(d, plan, chunks);
    expect(r.validCount).toBe(12_000);
    expect(r.joint.yield).toBeGreaterThan(0.99);
    expect(r.joint.yield).toBeLessThanOrEqual(1);
    expect(r.metrics.a21.count).toBe(0);
    expect(r.metrics.a12.sd).toBeGreaterThan(0);
    const ref = handWorked(d);
    expect(rel(r.nominal!.a11!, ref.a11)).toBeLessThan(1e-6);
    expect(rel(r.nominal!.a12!, ref.a12)).toBeLessThan(1e-6);
    // Influence: the plate gain follows RL and the cathode load; the unused RL2 and RG2 have none.
    const local = r.influence!.local.a11;
    expect(Math.abs(local.rl2!)).toBe(0);
    expect(Math.abs(local.rg2!)).toBe(0);
    expect(local.rl1!).toBeGreaterThan(0.5);
    expect(local.rt!).toBeLessThan(-0.5);
    // The same seed gives the same run.
    const again = mergeChunks(d, plan, chunks.slice().reverse());
    expect(again.joint).toEqual(r.joint);
  });
});
