import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDesign } from '../design/parseDesign.js';
import type { ResolvedDesign } from '../design/designSchema.js';
import { korenCurrent } from '../tubes/korenTriode.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import { largeSignalReport } from './largeSignalReport.js';
import { createSplitLoadLargeSignalStage } from './splitLoadLargeSignal.js';
import { createStagePoint } from './stagePoint.js';
import { bisect } from './testBisect.js';

function example(): ResolvedDesign {
  const url = new URL('../../examples/guitar-12au7-split-load.json', import.meta.url);
  const r = parseDesign(JSON.parse(readFileSync(url, 'utf8')));
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.design;
}

/**
 * An independent solve of the cathodyne's DC equations, written here with the cathode voltage as
 * the unknown (the model solves for the plate current): for a given Vk, J follows from its own
 * node balance (Rb, Rt and the grid leak), the current through Rb and Rload2 is the plate current,
 * which fixes the plate through RL and Rload1; bisection on Vk until the Koren current matches.
 * At rest (`rest` null) the grid sits at J and the loads carry nothing; driven, the grid is
 * J's rest voltage plus vin and the loads return to the rest voltages.
 */
function bisectionCathodyne(
  d: ResolvedDesign,
  vin: number,
  rest: { va: number; vk: number; vj: number } | null,
) {
  const tube = TUBE_CATALOG[d.tube.type].model;
  const p = d.parts;
  const [rl, rb, rt, rg] = [p.rl1.value, p.rk.value, p.rt.value, p.rg1.value];
  const [rload1, rload2] = [p.rload1!.value, p.rload2!.value];
  const bPlus = d.supply.bPlus;
  const solveAt = (vk: number) => {
    // At rest the grid leak carries nothing: J from Rb and Rt alone, the grid at J.
    const vj = rest
      ? (vk / rb + (rest.vj + vin) / rg) / (1 / rb + 1 / rg + 1 / rt)
      : vk / rb / (1 / rb + 1 / rt);
    const vg = rest ? rest.vj + vin : vj;
    const ia = (vk - vj) / rb + (rest ? (vk - rest.vk) / rload2 : 0);
    const va = rest ? (bPlus / rl + rest.va / rload1 - ia) / (1 / rl + 1 / rload1) : bPlus - ia * rl;
    return { vk, vj, vg, va, ia, vgk: vg - vk, err: ia - korenCurrent(tube, va - vk, vg - vk) };
  };
  // err rises with Vk (more current demanded, less supplied); Vk between its lowest and B+.
  const vk = bisect((v) => solveAt(v).err, rest ? rest.vk - 400 : 0, bPlus);
  return solveAt(vk);
}

describe('createSplitLoadLargeSignalStage', () => {
  it('rests at the bias point of the DC solver and agrees with an independent bisection solve, at rest and driven', () => {
    const d = example();
    const s = createSplitLoadLargeSignalStage(d);
    const m = createStagePoint(d)();
    expect(s.rest!.va1).toBeCloseTo(m.va1, 8);
    expect(s.rest!.vk).toBeCloseTo(m.vk, 8);
    const ref0 = bisectionCathodyne(d, 0, null);
    expect(s.rest!.vk).toBeCloseTo(ref0.vk, 6);
    const rest = { va: s.rest!.va1, vk: s.rest!.vk, vj: s.rest!.vj };
    for (const vin of [-60, -10, -1, 0.5, 5, 30]) {
      const ref = bisectionCathodyne(d, vin, rest);
      const p = s.at(vin)!;
      expect(p.va1).toBeCloseTo(ref.va, 6);
      expect(p.vk).toBeCloseTo(ref.vk, 6);
      expect(p.ia1).toBeCloseTo(ref.ia, 9);
      expect(p.vgk1).toBeCloseTo(ref.vgk, 6);
    }
  });

  it('has a slope at rest equal to the small-signal gains with the source resistance left out (existing closed form)', () => {
    const d = example();
    const s = createSplitLoadLargeSignalStage(d);
    const m = createStagePoint(d)({ rsource: 0 });
    const h = 1e-4;
    const hi = s.at(h)!;
    const lo = s.at(-h)!;
    expect((hi.va1 - lo.va1) / (2 * h) / m.a11).toBeCloseTo(1, 6);
    expect((hi.vk - lo.vk) / (2 * h) / m.a12).toBeCloseTo(1, 6);
  });
});

describe('largeSignalReport for a split-load design', () => {
  it('stops the drive where the section reaches Vgk = 0 or 1 µA, as a scan of the independent solve finds', () => {
    const d = example();
    const r = largeSignalReport(d);
    expect(r.status).toBe('ok');
    const s = createSplitLoadLargeSignalStage(d);
    const rest = { va: s.rest!.va1, vk: s.rest!.vk, vj: s.rest!.vj };
    const state = (p: ReturnType<typeof bisectionCathodyne>) =>
      p.vgk >= 0 ? 'grid-current-1' : p.ia < 1e-6 ? 'cut-off-1' : 'none';
    // A plain scan of the independent solve in 0.5 V steps finds each edge within a step.
    const scanEdge = (sign: 1 | -1) => {
      let v = 0;
      while (state(bisectionCathodyne(d, sign * (v + 0.5), rest)) === 'none') v += 0.5;
      return v;
    };
    for (const [edge, sign, limit] of [
      [r.drivePositive, 1, r.limitPositive],
      [r.driveNegative, -1, r.limitNegative],
    ] as const) {
      expect(limit).not.toBe('none');
      expect(state(bisectionCathodyne(d, sign * (edge - 1e-4), rest))).toBe('none');
      expect(state(bisectionCathodyne(d, sign * (edge + 1e-4), rest))).toBe(limit);
      const scanned = scanEdge(sign);
      expect(edge).toBeGreaterThanOrEqual(scanned);
      expect(edge).toBeLessThan(scanned + 0.5);
    }
    // The cathodyne clips into grid current going up, into cut-off going down.
    expect(r.limitPositive).toBe('grid-current-1');
    expect(r.limitNegative).toBe('cut-off-1');
    // Swings: each output's smaller excursion at ±the symmetrical drive, from the independent solve.
    const up = bisectionCathodyne(d, r.driveSymmetric, rest);
    const down = bisectionCathodyne(d, -r.driveSymmetric, rest);
    const swing = (a: number, b: number, at: number) => Math.min(Math.abs(a - at), Math.abs(b - at));
    expect(r.swing1).toBeCloseTo(swing(up.va, down.va, rest.va), 4);
    expect(r.swing2).toBeCloseTo(swing(up.vk, down.vk, rest.vk), 4);
  });

  it('H2/H1 at a small drive equals b·A/(2a) of the transfer’s Taylor terms (y = a·x + b·x², exact for the quadratic)', () => {
    const d = example();
    const s = createSplitLoadLargeSignalStage(d);
    const rest = { va: s.rest!.va1, vk: s.rest!.vk, vj: s.rest!.vj };
    const A = 1;
    const r = largeSignalReport(d, { drive: A });
    // a and b of each output from central differences of the independent solve.
    const h = 0.05;
    for (const [key, harm] of [
      ['va', r.out1!],
      ['vk', r.out2!],
    ] as const) {
      const y = (v: number) => bisectionCathodyne(d, v, rest)[key];
      const a = (y(h) - y(-h)) / (2 * h);
      const b = (y(h) - 2 * y(0) + y(-h)) / (2 * h * h);
      const expected = (100 * Math.abs(b) * A) / (2 * Math.abs(a));
      expect(harm.h2Percent / expected).toBeGreaterThan(0.97);
      expect(harm.h2Percent / expected).toBeLessThan(1.03);
      expect(harm.thdDb).toBeCloseTo(20 * Math.log10(harm.thdPercent / 100), 9);
      expect(harm.h1).toBeCloseTo(Math.abs(a) * A, 2);
    }
  });

  it('states the distortion at a given output level: output 1’s fundamental is that many volts peak', () => {
    const d = example();
    const r = largeSignalReport(d, { outputPeak: 20 });
    expect(r.out1!.h1).toBeCloseTo(20, 6);
    expect(r.drive).toBeLessThan(r.driveSymmetric);
    // Beyond the swing there is no such drive.
    const far = largeSignalReport(d, { outputPeak: 500 });
    expect(far.drive).toBe(Infinity);
    expect(far.out1).toBeNull();
  });
});
