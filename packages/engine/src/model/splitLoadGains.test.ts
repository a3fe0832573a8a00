import { describe, expect, it } from 'vitest';
import { lusolve } from 'mathjs';
import {
  G_A11,
  G_A12,
  G_SLOTS,
  G_ZIN,
  G_ZOUT1,
  G_ZOUT2,
  SS_MU1,
  SS_RG1,
  SS_RK,
  SS_RL1,
  SS_RLOAD1,
  SS_RLOAD2,
  SS_RP1,
  SS_RSOURCE,
  SS_RT,
  SS_SLOTS,
} from './reducedNodalGains.js';
import { splitLoadGainsArr } from './splitLoadGains.js';
import { lcg, logUniform as logU, relativeError as rel } from './testRandom.js';

interface Cathodyne {
  mu: number;
  rp: number;
  rl: number;
  rb: number;
  rt: number;
  rg: number;
  rload1: number;
  rload2: number;
  rs: number;
}

function closedForm(c: Cathodyne): Float64Array {
  const v = new Float64Array(SS_SLOTS);
  v[SS_MU1] = c.mu;
  v[SS_RP1] = c.rp;
  v[SS_RL1] = c.rl;
  v[SS_RK] = c.rb;
  v[SS_RT] = c.rt;
  v[SS_RG1] = c.rg;
  v[SS_RLOAD1] = c.rload1;
  v[SS_RLOAD2] = c.rload2;
  v[SS_RSOURCE] = c.rs;
  const g = new Float64Array(G_SLOTS);
  splitLoadGainsArr(v, g);
  return g;
}

/**
 * Independent reference: full nodal analysis of the cathodyne, written here from scratch. Unknowns
 * [vP, vK, vJ, vG]; the triode is a voltage-controlled current source i = gm·(vG − vK) + (vP − vK)/rp
 * from plate to cathode (gm = mu/rp); B+ and ground are AC ground. The source vs drives the grid
 * through Rs (Norton form), or holds vG itself when Rs = 0 or when `groundGrid` is set (the output
 * impedances). `inject` puts 1 A into a node with its external load removed. Solved by
 * mathjs.lusolve (mathjs as the independent solver).
 */
function nodal(c: Cathodyne, mode: 'gain' | 'zout1' | 'zout2'): number[] {
  const gm = c.mu / c.rp;
  const gp = 1 / c.rp;
  const gl1 = mode === 'zout1' ? 0 : 1 / c.rload1;
  const gl2 = mode === 'zout2' ? 0 : 1 / c.rload2;
  const gb = 1 / c.rb;
  const gt = 1 / c.rt;
  const gg = 1 / c.rg;
  const vs = mode === 'gain' ? 1 : 0;
  const A = [
    [1 / c.rl + gl1 + gp, -(gm + gp), 0, gm],
    [-gp, gm + gp + gb + gl2, -gb, -gm],
    [0, -gb, gb + gt + gg, -gg],
    [0, 0, -gg, 0],
  ];
  const b = [mode === 'zout1' ? 1 : 0, mode === 'zout2' ? 1 : 0, 0, 0];
  if (mode === 'gain' && c.rs > 0) {
    A[3] = [0, 0, -gg, gg + 1 / c.rs];
    b[3] = vs / c.rs;
  } else {
    A[3] = [0, 0, 0, 1];
    b[3] = vs;
  }
  return (lusolve(A, b) as number[][]).map((row) => row[0]);
}

function randomCathodyne(r: () => number): Cathodyne {
  return {
    ...{ mu: logU(r, 5, 120), rp: logU(r, 2e3, 1e5), rl: logU(r, 5e3, 3e5) },
    ...{ rb: logU(r, 100, 5e3), rt: logU(r, 5e3, 3e5), rg: logU(r, 1e5, 3e6) },
    rload1: r() < 0.3 ? Infinity : logU(r, 2e4, 1e6),
    rload2: r() < 0.3 ? Infinity : logU(r, 2e4, 1e6),
    rs: r() < 0.3 ? 0 : logU(r, 100, 1e5),
  };
}

describe('split-load closed form against an independent nodal solve (mathjs.lusolve)', () => {
  it('gains, input and output impedances agree on 500 random circuits to 1e-9', () => {
    const r = lcg(2026);
    let worst = 0;
    for (let t = 0; t < 500; t++) {
      const c = randomCathodyne(r);
      const g = closedForm(c);
      const [vp, vk, vj, vg] = nodal(c, 'gain');
      const zin = vg / ((vg - vj) / c.rg);
      const errs = [
        rel(g[G_A11], vp),
        rel(g[G_A12], vk),
        rel(g[G_ZIN], zin),
        rel(g[G_ZOUT1], nodal(c, 'zout1')[0]),
        rel(g[G_ZOUT2], nodal(c, 'zout2')[1]),
      ];
      worst = Math.max(worst, ...errs);
    }
    expect(worst).toBeLessThan(1e-9);
  });

  it('reduces to the textbook forms without grid leak, loads and source (common practice, no source)', () => {
    const r = lcg(5);
    for (let t = 0; t < 200; t++) {
      const c = { ...randomCathodyne(r), rg: 1e30, rload1: Infinity, rload2: Infinity, rs: 0 };
      const rk = c.rb + c.rt;
      const d = c.rp + c.rl + (c.mu + 1) * rk;
      const g = closedForm(c);
      expect(rel(g[G_A11], (-c.mu * c.rl) / d)).toBeLessThan(1e-9);
      expect(rel(g[G_A12], (c.mu * rk) / d)).toBeLessThan(1e-9);
      const par = (a: number, b: number) => (a * b) / (a + b);
      expect(rel(g[G_ZOUT1], par(c.rl, c.rp + (c.mu + 1) * rk))).toBeLessThan(1e-9);
      expect(rel(g[G_ZOUT2], par(rk, (c.rp + c.rl) / (c.mu + 1)))).toBeLessThan(1e-9);
    }
  });

  it('equal loads RL = RK give |A| = mu·R/(rp + (mu+2)·R) < 1 on both outputs (common practice, no source)', () => {
    for (const [mu, rp, R] of [
      [17, 7.7e3, 22e3],
      [100, 62.5e3, 100e3],
      [20, 7.7e3, 10e3],
    ]) {
      const g = closedForm({
        mu,
        rp,
        rl: R,
        rb: 0.05 * R,
        rt: 0.95 * R,
        rg: 1e30,
        rload1: Infinity,
        rload2: Infinity,
        rs: 0,
      });
      const known = (mu * R) / (rp + (mu + 2) * R);
      expect(rel(-g[G_A11], known)).toBeLessThan(1e-9);
      expect(rel(g[G_A12], known)).toBeLessThan(1e-9);
      expect(known).toBeLessThan(1);
      expect(known).toBeGreaterThan(0.7);
    }
  });
});
