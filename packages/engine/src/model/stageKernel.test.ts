import { describe, expect, it } from 'vitest';
import { buildDesign } from '../design/exampleDesign.js';
import type { ResolvedDesign } from '../design/designSchema.js';
import { createStageKernel, INPUTS, METRIC_IDS } from './stageKernel.js';
import { BAND_FREQUENCIES } from './metrics.js';
import { acResponse } from './acResponse.js';
import { nodalGains } from './nodalGains.js';
import { korenCurrent } from '../tubes/korenTriode.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import { lcg } from './testRandom.js';

const col = (id: (typeof METRIC_IDS)[number]) => METRIC_IDS.indexOf(id);
const inp = (id: (typeof INPUTS)[number]) => INPUTS.indexOf(id);

function run(design: ResolvedDesign, n: number, spread: number, opts?: { dcPerSample?: boolean }) {
  const k = createStageKernel(design, opts);
  const nom = k.nominalInputs();
  const r = lcg(42);
  const inputs = k.inputs.map((id, i) =>
    Float64Array.from({ length: n }, () =>
      id === 'rsource' && nom[i] === 0 ? 0 : nom[i] * (1 + spread * (r() - 0.5)),
    ),
  );
  const out = k.metrics.map(() => new Float64Array(n));
  k.evaluate(inputs, n, out);
  return { k, inputs, out };
}

const loaded = (): ResolvedDesign => {
  const d = buildDesign({
    tube: { type: '12AT7', spread: { perveanceSd: 10, muSd: 3, sectionCorrelation: 0 } },
  });
  d.parts.rload1 = { value: 100e3, tolerance: 5, spread: { kind: 'normal' } };
  d.parts.rload2 = { value: 150e3, tolerance: 5, spread: { kind: 'normal' } };
  d.parts.rsource = { value: 10e3, tolerance: 5, spread: { kind: 'normal' } };
  return d;
};

const direct = (): ResolvedDesign => {
  const d = buildDesign({
    topology: 'direct-coupled',
    supply: { bPlus: 330, tail: -150 },
    drive: { grid1Dc: 0, grid2: { mode: 'leak-to-grid1' } },
    tube: { type: '6SN7', spread: { perveanceSd: 10, muSd: 3, sectionCorrelation: 0 } },
  });
  Object.assign(d.parts, { rl1: { ...d.parts.rl1, value: 22e3 }, rl2: { ...d.parts.rl2, value: 24e3 } });
  Object.assign(d.parts, { rk: { ...d.parts.rk, value: 1e3 }, rt: { ...d.parts.rt, value: 15e3 } });
  return d;
};

describe('createStageKernel', () => {
  it('lists inputs and metrics in contract order with nominal inputs (absent loads ∞, source 0)', () => {
    const k = createStageKernel(buildDesign());
    expect(k.inputs).toEqual(INPUTS);
    // No capacitors, no frequency specs: exactly the midband columns.
    expect(k.metrics).toEqual(METRIC_IDS);
    const withCaps = buildDesign();
    withCaps.parts.cout1 = { value: 22e-9, tolerance: 10, spread: { kind: 'normal' } };
    withCaps.specs = [{ metric: 'acPhaseDeg', frequency: 15, max: 5 }];
    expect(createStageKernel(withCaps).metrics).toEqual([
      ...METRIC_IDS,
      ...['fLow1', 'fLow2', 'fHigh1', 'fHigh2'],
      ...['acGain1@15', 'acGain2@15', 'acBalanceDb@15', 'acPhaseDeg@15'],
      ...BAND_FREQUENCIES.map((f) => `acBalanceDb@${f}`),
    ]);
    const nom = k.nominalInputs();
    expect(nom[inp('rl1')]).toBe(82e3);
    expect(nom[inp('rload1')]).toBe(Infinity);
    expect(nom[inp('rsource')]).toBe(0);
    expect(nom[inp('perv2')]).toBe(1);
  });

  it.each([
    ['cap-coupled', buildDesign],
    ['loaded 12AT7', loaded],
    ['direct-coupled, negative tail', direct],
  ])('%s: each sample satisfies the triode model and the reference nodal solve', (_n, make) => {
    const design = make();
    const { inputs, out } = run(design, 300, 0.2);
    const tube = TUBE_CATALOG[design.tube.type].model;
    for (let s = 0; s < 300; s++) {
      expect(out[col('valid')][s]).toBe(1);
      const vk = out[col('vk')][s];
      const ia1 = korenCurrent(
        tube,
        out[col('va1')][s] - vk,
        out[col('vgk1')][s],
        inputs[inp('perv1')][s],
        inputs[inp('mu1')][s],
      );
      expect(Math.abs(ia1 / out[col('ia1')][s] - 1)).toBeLessThan(1e-8);
      // Ohm's law at plate 1 and the tail.
      expect(out[col('va1')][s]).toBeCloseTo(
        design.supply.bPlus - out[col('ia1')][s] * inputs[inp('rl1')][s],
        6,
      );
      const g = nodalGains({
        capCoupled: design.topology === 'cap-coupled',
        leakToGrid1: design.drive?.grid2.mode === 'leak-to-grid1',
        ...Object.fromEntries(INPUTS.slice(0, 9).map((id) => [id, inputs[inp(id)][s]])),
        mu1: out[col('mu1')][s],
        mu2: out[col('mu2')][s],
        rp1: out[col('rp1')][s],
        rp2: out[col('rp2')][s],
      } as Parameters<typeof nodalGains>[0]);
      for (const m of ['a11', 'a12', 'a21', 'a22', 'zout1', 'zout2'] as const)
        expect(Math.abs(out[col(m)][s] / g[m] - 1)).toBeLessThan(1e-9);
      expect(out[col('balanceDb')][s]).toBeCloseTo(20 * Math.log10(Math.abs(g.a12 / g.a11)), 9);
      expect(out[col('pd1')][s]).toBeCloseTo(out[col('ia1')][s] * (out[col('va1')][s] - vk), 12);
    }
  });

  it('small-signal-only mode equals the full mode at nominal inputs', () => {
    const design = loaded();
    const a = run(design, 1, 0);
    const b = run(design, 1, 0, { dcPerSample: false });
    for (let m = 0; m < METRIC_IDS.length; m++)
      if (a.out[m][0] !== b.out[m][0]) expect(Math.abs(b.out[m][0] / a.out[m][0] - 1)).toBeLessThan(1e-9);
  });

  it('marks samples without a bias point invalid (valid = 0, NaN elsewhere) and keeps going', () => {
    const design = direct();
    const k = createStageKernel(design);
    const nom = k.nominalInputs();
    const inputs = k.inputs.map((_, i) => Float64Array.of(nom[i], nom[i], nom[i]));
    inputs[inp('rt')][1] = 1e9; // tail current ≈ 0.15 µA: both sections cut off
    const out = k.metrics.map(() => new Float64Array(3));
    k.evaluate(inputs, 3, out);
    for (const [id, bad] of [
      ['rl1', -1e3],
      ['rk', Number.NaN],
      ['rg2', 0],
      ['perv1', -0.1],
    ] as const) {
      const row = k.inputs.map((_, i) => Float64Array.of(nom[i]));
      row[inp(id)][0] = bad;
      const o = k.metrics.map(() => new Float64Array(1));
      k.evaluate(row, 1, o);
      expect(o[col('valid')][0]).toBe(0);
    }
    expect(out[col('valid')][1]).toBe(0);
    expect(out[col('ia1')][1]).toBeNaN();
    expect(out[col('balanceDb')][1]).toBeNaN();
    expect(out[col('valid')][2]).toBe(1);
    expect(out[col('ia1')][2]).toBe(out[col('ia1')][0]);
  });

  it('writes only the first n samples', () => {
    const k = createStageKernel(buildDesign());
    const nom = k.nominalInputs();
    const inputs = k.inputs.map((_, i) => new Float64Array(4).fill(nom[i]));
    const out = k.metrics.map(() => new Float64Array(4).fill(-7));
    k.evaluate(inputs, 2, out);
    expect(out[col('a11')][1]).toBeLessThan(0);
    expect(out[col('a11')][2]).toBe(-7);
  });
});

describe('createStageKernel frequency columns', () => {
  const capDesign = (): ResolvedDesign => {
    const d = loaded();
    const cap = (value: number) => ({ value, tolerance: 10, spread: { kind: 'normal' as const } });
    Object.assign(d.parts, {
      ...{ cin: cap(47e-9), cg2: cap(220e-9), cout1: cap(22e-9), cout2: cap(22e-9) },
      ...{ cstray1: cap(100e-12), cstray2: cap(120e-12) },
    });
    d.specs = [{ metric: 'acBalanceDb', frequency: 20e3, min: -1, max: 1 }];
    return d;
  };

  it('per sample: the frequency metrics are those of the sample’s own circuit, the −3 dB points halve the power', () => {
    const d = capDesign();
    const { k, inputs, out } = run(d, 40, 0.3);
    const at = (id: string, s: number) => out[k.metrics.indexOf(id)][s];
    const x = (id: (typeof INPUTS)[number], s: number) => inputs[inp(id)][s];
    const tube = TUBE_CATALOG[d.tube.type].capacitance;
    for (let s = 0; s < 40; s++) {
      if (at('valid', s) !== 1) continue;
      const circuit = {
        ...{ capCoupled: true, leakToGrid1: false, mu1: at('mu1', s), mu2: at('mu2', s) },
        ...{ rp1: at('rp1', s), rp2: at('rp2', s), rl1: x('rl1', s), rl2: x('rl2', s) },
        ...{ rk: x('rk', s), rt: x('rt', s), rg1: x('rg1', s), rg2: x('rg2', s) },
        ...{ rload1: x('rload1', s), rload2: x('rload2', s), rsource: x('rsource', s) },
        ...{ cin: x('cin', s), cg2: x('cg2', s), cout1: x('cout1', s), cout2: x('cout2', s) },
        ...{ cstray1: x('cstray1', s), cstray2: x('cstray2', s) },
        ...{
          cgk1: tube.cin,
          cgk2: tube.cin,
          cgp1: tube.cgp,
          cgp2: tube.cgp,
          cpk1: tube.cout,
          cpk2: tube.cout,
        },
      };
      const h = acResponse(circuit, 20e3);
      const bal = 20 * Math.log10(Math.hypot(h.h2.re, h.h2.im) / Math.hypot(h.h1.re, h.h1.im));
      expect(at('acBalanceDb@20000', s)).toBeCloseTo(bal, 9);
      expect(at('acGain1@20000', s)).toBeCloseTo(Math.hypot(h.h1.re, h.h1.im), 9);
      for (const [id, which, ref] of [
        ['fLow1', 'h1', at('a11', s)],
        ['fLow2', 'h2', at('a12', s)],
        ['fHigh1', 'h1', at('a11', s)],
        ['fHigh2', 'h2', at('a12', s)],
      ] as const) {
        const r = acResponse(circuit, at(id, s))[which];
        expect(Math.abs((r.re ** 2 + r.im ** 2) / ref ** 2 - 0.5)).toBeLessThan(1e-5);
      }
    }
  });
});
