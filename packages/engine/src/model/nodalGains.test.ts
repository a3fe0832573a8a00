import { describe, expect, it } from 'vitest';
import { Matrix, solve } from 'ml-matrix';
import { nodalGains } from './nodalGains.js';
import { reducedNodalGainsInto, type SmallSignalCircuit } from './reducedNodalGains.js';
import { closedFormGainsInto, createStageGains } from './closedFormGains.js';
import { solveDenseInPlace } from './denseSolve.js';
import { lcg, logUniform as logU, relativeError as rel } from './testRandom.js';

function randomCircuit(r: () => number): SmallSignalCircuit {
  const mode = r();
  return {
    capCoupled: mode < 0.5,
    leakToGrid1: mode >= 0.75,
    ...{ mu1: logU(r, 5, 120), mu2: logU(r, 5, 120), rp1: logU(r, 2e3, 1e5), rp2: logU(r, 2e3, 1e5) },
    ...{ rl1: logU(r, 5e3, 3e5), rl2: logU(r, 5e3, 3e5), rk: logU(r, 50, 5e3), rt: logU(r, 1e3, 1e5) },
    ...{ rg1: logU(r, 1e5, 3e6), rg2: logU(r, 1e5, 3e6) },
    rload1: r() < 0.3 ? Infinity : logU(r, 2e4, 1e6),
    rload2: r() < 0.3 ? Infinity : logU(r, 2e4, 1e6),
    rsource: r() < 0.3 ? 0 : logU(r, 100, 1e5),
  };
}

describe('dense solver', () => {
  it('matches ml-matrix on random well-conditioned systems (ml-matrix)', () => {
    const r = lcg(7);
    for (let t = 0; t < 200; t++) {
      const n = 2 + Math.floor(r() * 8);
      const rows = Array.from({ length: n }, (_, i) =>
        Array.from({ length: n }, (_, j) => r() - 0.5 + (i === j ? n : 0)),
      );
      const b = Array.from({ length: n }, () => r() - 0.5);
      const ref = solve(new Matrix(rows), Matrix.columnVector(b)).to1DArray();
      const a = Float64Array.from(rows.flat());
      const x = Float64Array.from(b);
      expect(solveDenseInPlace(a, x, n)).toBe(true);
      ref.forEach((v, i) => expect(Math.abs(x[i] - v)).toBeLessThan(1e-12));
    }
  });
});

describe('exact small-signal solvers', () => {
  it('the hand-reduced solve equals the full nodal analysis on 2,000 random circuits', () => {
    const r = lcg(99);
    const g = createStageGains();
    for (let t = 0; t < 2000; t++) {
      const c = randomCircuit(r);
      const ref = nodalGains(c);
      reducedNodalGainsInto(c, g);
      for (const k of ['a11', 'a12', 'a21', 'a22', 'zout1', 'zout2', 'zin'] as const)
        expect(rel(g[k], ref[k])).toBeLessThan(1e-9);
    }
  });

  it('reduces to the closed form without grid leaks, loads and source resistance', () => {
    const r = lcg(5);
    const g = createStageGains();
    for (let t = 0; t < 500; t++) {
      const c = {
        ...randomCircuit(r),
        capCoupled: false,
        leakToGrid1: false,
        rload1: Infinity,
        rload2: Infinity,
        rsource: 0,
      };
      const ref = nodalGains(c);
      closedFormGainsInto(c.mu1, c.mu2, c.rp1, c.rp2, c.rl1, c.rl2, c.rk + c.rt, g);
      for (const k of ['a11', 'a12', 'a21', 'a22', 'zout1', 'zout2'] as const)
        expect(rel(g[k], ref[k])).toBeLessThan(1e-9);
    }
  });

  it('an infinite tail balances matched sections exactly: 0 dB (analytic result)', () => {
    const r = lcg(11);
    for (let t = 0; t < 200; t++) {
      const c = randomCircuit(r);
      // Direct-coupled with a fixed grid 2 keeps grid leaks off the tail; loads equal.
      Object.assign(c, {
        capCoupled: false,
        leakToGrid1: false,
        rt: 1e15,
        mu2: c.mu1,
        rp2: c.rp1,
        rl2: c.rl1,
        rload2: c.rload1,
      });
      const g = nodalGains(c);
      expect(Math.abs(20 * Math.log10(Math.abs(g.a12 / g.a11)))).toBeLessThan(1e-8);
    }
  });

  it('matched sections with equal loads give A11 − A12 = −mu·RL/(RL + rp) for any tail (analytic result)', () => {
    const r = lcg(13);
    for (let t = 0; t < 500; t++) {
      const c = randomCircuit(r);
      Object.assign(c, { mu2: c.mu1, rp2: c.rp1, rl2: c.rl1, rload2: c.rload1, rg2: c.rg1, rsource: 0 });
      const rl = Number.isFinite(c.rload1) ? (c.rl1 * c.rload1) / (c.rl1 + c.rload1) : c.rl1;
      const g = nodalGains(c);
      expect(rel(g.a11 - g.a12, (-c.mu1 * rl) / (rl + c.rp1))).toBeLessThan(1e-9);
      const h = reducedNodalGainsInto(c, createStageGains());
      expect(rel(h.a11 - h.a12, (-c.mu1 * rl) / (rl + c.rp1))).toBeLessThan(1e-9);
    }
  });

  it('bootstraps the grid leak: Zin at grid 1 exceeds RG1 in the cap-coupled form (analytic result)', () => {
    const c = randomCircuit(lcg(3));
    Object.assign(c, { capCoupled: true, leakToGrid1: false });
    const g = nodalGains(c);
    expect(g.zin).toBeGreaterThan(c.rg1);
  });
});
