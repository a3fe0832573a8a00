import { describe, expect, it } from 'vitest';
import { Matrix, solve } from 'ml-matrix';
import { closedFormGainsInto, createStageGains } from './closedFormGains.js';
import { lcg, logUniform } from './testRandom.js';

/** Small deterministic generator for test circuits (common practice, no source). */

/**
 * Node equations of the ideal pair in (Vp1, Vp2, Vk), solved by ml-matrix (an independent general
 * matrix library). Grids are ideal sources; plate current i = gm·(vg − vk) + (vp − vk)/rp.
 */
function referenceSolve(
  p: { mu1: number; mu2: number; rp1: number; rp2: number; rl1: number; rl2: number; rkk: number },
  vg1: number,
  vg2: number,
  inject: [number, number],
) {
  const g1 = p.mu1 / p.rp1;
  const g2 = p.mu2 / p.rp2;
  const A = [
    [1 / p.rl1 + 1 / p.rp1, 0, -1 / p.rp1 - g1],
    [0, 1 / p.rl2 + 1 / p.rp2, -1 / p.rp2 - g2],
    [-1 / p.rp1, -1 / p.rp2, 1 / p.rkk + 1 / p.rp1 + 1 / p.rp2 + g1 + g2],
  ];
  const b = [-g1 * vg1 + inject[0], -g2 * vg2 + inject[1], g1 * vg1 + g2 * vg2];
  return solve(new Matrix(A), Matrix.columnVector(b)).to1DArray();
}

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('closed-form gains against ml-matrix node solves', () => {
  it('agree to 1e-9 relative, signs included, on 2,000 random circuits (ml-matrix)', () => {
    const r = lcg(20261202);
    const g = createStageGains();
    for (let n = 0; n < 2000; n++) {
      const p = {
        mu1: logUniform(r, 5, 120),
        mu2: logUniform(r, 5, 120),
        rp1: logUniform(r, 2e3, 1e5),
        rp2: logUniform(r, 2e3, 1e5),
        rl1: logUniform(r, 5e3, 3e5),
        rl2: logUniform(r, 5e3, 3e5),
        rkk: logUniform(r, 100, 2e5),
      };
      closedFormGainsInto(p.mu1, p.mu2, p.rp1, p.rp2, p.rl1, p.rl2, p.rkk, g);
      const d1 = referenceSolve(p, 1, 0, [0, 0]);
      const d2 = referenceSolve(p, 0, 1, [0, 0]);
      const z1 = referenceSolve(p, 0, 0, [1, 0]);
      const z2 = referenceSolve(p, 0, 0, [0, 1]);
      expect(rel(g.a11, d1[0])).toBeLessThan(1e-9);
      expect(rel(g.a12, d1[1])).toBeLessThan(1e-9);
      expect(rel(g.a21, d2[0])).toBeLessThan(1e-9);
      expect(rel(g.a22, d2[1])).toBeLessThan(1e-9);
      expect(rel(g.zout1, z1[0])).toBeLessThan(1e-9);
      expect(rel(g.zout2, z2[1])).toBeLessThan(1e-9);
      expect(Math.sign(g.a11)).toBe(-1);
      expect(Math.sign(g.a12)).toBe(1);
      // The balance formula follows from A11 and A12 (analytic result).
      const R2 = p.rl2 + p.rp2;
      expect(
        rel(Math.abs(g.a12 / g.a11), (p.rl2 / p.rl1) * (p.rkk / (p.rkk + R2 / (p.mu2 + 1)))),
      ).toBeLessThan(1e-9);
    }
  });
});
