import { describe, expect, it } from 'vitest';
import { buildDesign } from '../design/exampleDesign.js';
import { korenCurrent } from '../tubes/korenTriode.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import { createLargeSignalStage } from './largeSignal.js';
import { largeSignalReport } from './largeSignalReport.js';
import { createStagePoint } from './stagePoint.js';
import { bisect } from './testBisect.js';

const design = () => {
  const d = buildDesign();
  d.parts.rload1 = { value: 470e3, tolerance: 5, spread: { kind: 'normal' } };
  d.parts.rload2 = { value: 470e3, tolerance: 5, spread: { kind: 'normal' } };
  return d;
};

/**
 * An independent solve of the same quasi-static equations: for a given cathode voltage the plate
 * nodes are found by bisection one at a time, then the cathode by bisection on its current balance
 * (nested bracketing, no derivatives). Cap-coupled, drive vin on grid 1.
 */
function bisectionPair(vin: number, rest: { va1: number; va2: number; vj: number } | null) {
  const d = design();
  const tube = TUBE_CATALOG[d.tube.type].model;
  const p = d.parts;
  const [rl1, rl2, rk, rt, rg1, rg2] = [p.rl1, p.rl2!, p.rk, p.rt, p.rg1, p.rg2!].map((x) => x.value);
  const [rload1, rload2] = [p.rload1!.value, p.rload2!.value];
  const bPlus = d.supply.bPlus;
  // Given Vk and VJ: each plate from its own node balance (monotone in Va).
  const plates = (vk: number, g1: number, g2: number) => {
    const va1 = bisect(
      (va) =>
        (bPlus - va) / rl1 + (rest ? (rest.va1 - va) / rload1 : 0) - korenCurrent(tube, va - vk, g1 - vk),
      vk,
      bPlus + 1000,
    );
    const va2 = bisect(
      (va) =>
        (bPlus - va) / rl2 + (rest ? (rest.va2 - va) / rload2 : 0) - korenCurrent(tube, va - vk, g2 - vk),
      vk,
      bPlus + 1000,
    );
    return { va1, va2, ia: korenCurrent(tube, va1 - vk, g1 - vk) + korenCurrent(tube, va2 - vk, g2 - vk) };
  };
  // VJ from the cathode current through Rk and the J balance; Vk by bisection on that balance.
  const solveAt = (vk: number) => {
    // J balance: (Vk − VJ)/Rk + leaks = VJ/Rt with grids at g1 = VJrest + vin (or VJ at rest).
    const g1For = (vj: number) => (rest ? rest.vj + vin : vj);
    const g2For = (vj: number) => (rest ? rest.vj : vj);
    const vj = bisect(
      (vj) => (vk - vj) / rk + (g1For(vj) - vj) / rg1 + (g2For(vj) - vj) / rg2 - vj / rt,
      -100,
      vk,
    );
    const [g1, g2] = [g1For(vj), g2For(vj)];
    const pl = plates(vk, g1, g2);
    const ia1 = korenCurrent(tube, pl.va1 - vk, g1 - vk);
    const ia2 = korenCurrent(tube, pl.va2 - vk, g2 - vk);
    return { vj, ...pl, ia1, ia2, vgk1: g1 - vk, vgk2: g2 - vk, err: pl.ia - (vk - vj) / rk };
  };
  const vk = bisect((v) => solveAt(v).err, 0.01, 200);
  const s = solveAt(vk);
  return { vk, ...s };
}

describe('createLargeSignalStage', () => {
  it('rests at the bias point of the DC solver (existing bias solver)', () => {
    const d = design();
    const s = createLargeSignalStage(d);
    const m = createStagePoint(d)();
    expect(s.rest!.va1).toBeCloseTo(m.va1, 6);
    expect(s.rest!.va2).toBeCloseTo(m.va2, 6);
    expect(s.rest!.vk).toBeCloseTo(m.vk, 6);
  });

  it('agrees with an independent bisection solve of the same equations, at rest and driven', () => {
    const s = createLargeSignalStage(design());
    const rest = bisectionPair(0, null);
    expect(s.rest!.va1).toBeCloseTo(rest.va1, 5);
    expect(s.rest!.vk).toBeCloseTo(rest.vk, 5);
    for (const vin of [-3, -1, 0.5, 2]) {
      const ref = bisectionPair(vin, s.rest);
      const p = s.at(vin)!;
      expect(p.va1).toBeCloseTo(ref.va1, 5);
      expect(p.va2).toBeCloseTo(ref.va2, 5);
      expect(p.vk).toBeCloseTo(ref.vk, 5);
    }
  });

  it('has a slope at rest equal to the small-signal gains (existing nodal solve)', () => {
    const d = design();
    const s = createLargeSignalStage(d);
    const m = createStagePoint(d)();
    const h = 1e-4;
    const slope1 = (s.at(h)!.va1 - s.at(-h)!.va1) / (2 * h);
    const slope2 = (s.at(h)!.va2 - s.at(-h)!.va2) / (2 * h);
    expect(slope1 / m.a11).toBeCloseTo(1, 5);
    expect(slope2 / m.a12).toBeCloseTo(1, 5);
  });
});

describe('largeSignalReport', () => {
  it('stops the drive where a section reaches Vgk = 0 or 1 µA, as a direct scan of the independent solve finds', () => {
    const r = largeSignalReport(design());
    expect(r.status).toBe('ok');
    const s = createLargeSignalStage(design());
    // Just inside and just outside each edge, judged on the independent bisection solve.
    const state = (p: ReturnType<typeof bisectionPair>) =>
      p.vgk1 >= 0
        ? 'grid-current-1'
        : p.vgk2 >= 0
          ? 'grid-current-2'
          : p.ia1 < 1e-6
            ? 'cut-off-1'
            : p.ia2 < 1e-6
              ? 'cut-off-2'
              : 'none';
    for (const [edge, sign, limit] of [
      [r.drivePositive, 1, r.limitPositive],
      [r.driveNegative, -1, r.limitNegative],
    ] as const) {
      expect(limit).not.toBe('none');
      expect(state(bisectionPair(sign * (edge - 1e-4), s.rest))).toBe('none');
      expect(state(bisectionPair(sign * (edge + 1e-4), s.rest))).toBe(limit);
    }
    expect(r.driveSymmetric).toBe(Math.min(r.drivePositive, r.driveNegative));
    expect(r.swing1).toBeGreaterThan(0);
    expect(r.out1!.thdPercent).toBeGreaterThan(0);
    expect(r.out1!.thdDb).toBeCloseTo(20 * Math.log10(r.out1!.thdPercent / 100), 9);
  });
});
