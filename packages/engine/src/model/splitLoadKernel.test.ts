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
import { createStageKernel } from './stageKernel.js';
import { nominalFrequencyResponse } from './nominalFrequencyResponse.js';
import {
  AC_CGK1,
  AC_CGP1,
  AC_CIN,
  AC_COUT1,
  AC_COUT2,
  AC_CPK1,
  AC_CSTRAY1,
  AC_CSTRAY2,
  AC_SLOTS,
  H1_IM,
  H1_RE,
  H2_IM,
  H2_RE,
  H_SLOTS,
} from './acResponse.js';
import {
  SS_MU1,
  SS_RG1,
  SS_RK,
  SS_RL1,
  SS_RLOAD1,
  SS_RLOAD2,
  SS_RP1,
  SS_RSOURCE,
  SS_RT,
} from './reducedNodalGains.js';
import { splitLoadResponseArr } from './splitLoadResponse.js';

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
    // The 20 Hz balance spec costs about 1 % (the coupling capacitors are ±10 %).
    expect(r.joint.yield).toBeGreaterThan(0.97);
    expect(r.joint.yield).toBeLessThanOrEqual(1);
    expect(r.metrics.a21.count).toBe(0);
    expect(r.metrics.a12.sd).toBeGreaterThan(0);
    const ref = handWorked(d);
    expect(rel(r.nominal!.a11!, ref.a11)).toBeLessThan(1e-6);
    expect(rel(r.nominal!.a12!, ref.a12)).toBeLessThan(1e-6);
    // Influence: the plate gain follows RL and the cathode load; RL2 and RG2 are not parts of it.
    const local = r.influence!.local.a11;
    expect(local.rl2).toBeUndefined();
    expect(local.rg2).toBeUndefined();
    expect(local.rl1!).toBeGreaterThan(0.5);
    expect(local.rt!).toBeLessThan(-0.5);
    // The same seed gives the same run.
    const again = mergeChunks(d, plan, chunks.slice().reverse());
    expect(again.joint).toEqual(r.joint);
  });

  it('frequency columns and −3 dB points per sample agree with a direct solve, and frequency specs judge samples', () => {
    const d = withCapacitors(example());
    const k = createStageKernel(d);
    const n = 40;
    const nominal = k.nominalInputs();
    // Samples: nominal with every part and the tube scattered by up to ±20 %.
    const r = (
      (seed) => () =>
        (seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 2 ** 32
    )(7);
    const inputs = k.inputs.map((_, i) =>
      Float64Array.from({ length: n }, () =>
        Number.isFinite(nominal[i]) && nominal[i] > 0 ? nominal[i] * (0.8 + 0.4 * r()) : nominal[i],
      ),
    );
    const out = k.metrics.map(() => new Float64Array(n));
    k.evaluate(inputs, n, out);
    const at = (id: string, s: number) => out[k.metrics.indexOf(id)][s];
    const x = (id: string, s: number) => inputs[k.inputs.indexOf(id as never)][s];
    expect(k.metrics).toContain('fLow2');
    expect(k.metrics).toContain('acPhaseDeg@20000');
    const tube = TUBE_CATALOG[d.tube.type].capacitance;
    const h = new Float64Array(H_SLOTS);
    let checked = 0;
    for (let s = 0; s < n; s++) {
      expect(at('valid', s)).toBe(1);
      const v = new Float64Array(AC_SLOTS);
      v[SS_MU1] = at('mu1', s);
      v[SS_RP1] = at('rp1', s);
      v[SS_RL1] = x('rl1', s);
      v[SS_RK] = x('rk', s);
      v[SS_RT] = x('rt', s);
      v[SS_RG1] = x('rg1', s);
      v[SS_RLOAD1] = x('rload1', s);
      v[SS_RLOAD2] = x('rload2', s);
      v[SS_RSOURCE] = x('rsource', s);
      v[AC_CIN] = x('cin', s);
      v[AC_COUT1] = x('cout1', s);
      v[AC_COUT2] = x('cout2', s);
      v[AC_CSTRAY1] = x('cstray1', s);
      v[AC_CSTRAY2] = x('cstray2', s);
      v[AC_CGK1] = tube.cin;
      v[AC_CGP1] = tube.cgp;
      v[AC_CPK1] = tube.cout;
      splitLoadResponseArr(v, 20e3, h);
      const m1 = Math.hypot(h[H1_RE], h[H1_IM]);
      const m2 = Math.hypot(h[H2_RE], h[H2_IM]);
      expect(at('acGain1@20000', s)).toBeCloseTo(m1, 12);
      expect(at('acGain2@20000', s)).toBeCloseTo(m2, 12);
      expect(at('acBalanceDb@20000', s)).toBeCloseTo(20 * Math.log10(m2 / m1), 9);
      for (const [id, which, ref] of [
        ['fLow1', 1, at('a11', s)],
        ['fLow2', 2, at('a12', s)],
        ['fHigh1', 1, at('a11', s)],
        ['fHigh2', 2, at('a12', s)],
      ] as const) {
        const f = at(id, s);
        expect(f).toBeGreaterThan(0);
        expect(Number.isFinite(f)).toBe(true);
        splitLoadResponseArr(v, f, h);
        const m = which === 1 ? Math.hypot(h[H1_RE], h[H1_IM]) : Math.hypot(h[H2_RE], h[H2_IM]);
        expect(Math.abs((m * m) / (ref * ref) - 0.5)).toBeLessThan(1e-5);
      }
      checked++;
    }
    expect(checked).toBe(n);
    // The editor's plot agrees with the kernel at nominal.
    const fr = nominalFrequencyResponse(d, [20e3]);
    const nom = createStagePoint(d)();
    expect(fr.status).toBe('ok');
    expect(fr.balanceDb[0]).toBeCloseTo(nom['acBalanceDb@20000'], 10);
    expect(fr.phaseDeg[0]).toBeCloseTo(nom['acPhaseDeg@20000'], 10);
    // The grid's input pole (33k source against the input capacitance) sets both high corners.
    expect(nom.fHigh2 / nom.fHigh1).toBeGreaterThan(0.8);
    expect(nom.fHigh2 / nom.fHigh1).toBeLessThan(1.25);
    // A frequency spec judges split-load samples like any other spec.
    const plan: RunPlan = { samples: 4096, seed: 'cathodyne-ac', plan: 'random', chunkSize: 4096 };
    const run = mergeChunks(d, plan, [runChunk(d, plan, 0)]);
    const spec = run.specs.find((q) => q.metric === 'acBalanceDb' && q.frequency === 20000)!;
    expect(spec.yield).toBeGreaterThan(0.5);
    expect(spec.yield).toBeLessThanOrEqual(1);
    expect(run.metrics['fLow1'].count).toBe(4096);
    // Influence and worst case reach the frequency columns as for the pair: the coupling
    // capacitors move the 20 Hz balance, and its worst-case range holds the nominal.
    const bal20 = 'acBalanceDb@20';
    const ranked = run.influence!.spearman[bal20];
    expect(ranked).toBeDefined();
    const wc = run.worstCase!.metrics[bal20];
    expect(wc.min).toBeLessThanOrEqual(nom[bal20]);
    expect(wc.max).toBeGreaterThanOrEqual(nom[bal20]);
    expect(wc.max! - wc.min!).toBeGreaterThan(0.1);
  });
});

/** The example with input and output coupling capacitors, strays and a 20 kHz balance spec. */
function withCapacitors(d: ResolvedDesign): ResolvedDesign {
  const cap = (value: number, tolerance: number) => ({
    value,
    tolerance,
    spread: { kind: 'normal' as const },
  });
  return {
    ...d,
    parts: {
      ...d.parts,
      cin: cap(22e-9, 10),
      cout1: cap(47e-9, 10),
      cout2: cap(47e-9, 10),
      cstray1: cap(100e-12, 30),
      cstray2: cap(100e-12, 30),
    },
    specs: [...d.specs, { metric: 'acBalanceDb', frequency: 20000, min: -1, max: 1 }],
  };
}
