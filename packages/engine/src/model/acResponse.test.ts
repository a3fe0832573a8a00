import { describe, expect, it } from 'vitest';
import { complex, lusolve, type Complex as MathComplex } from 'mathjs';
import { AC_SLOTS, acResponse, H_SLOTS, pairAcSolver, writeAcCircuit, type AcCircuit } from './acResponse.js';
import { cornerFrequencyArr } from './cornerFrequency.js';
import { createStageGains } from './closedFormGains.js';
import { reducedNodalGainsInto } from './reducedNodalGains.js';
import { solveComplexInPlace } from './complexSolve.js';
import { lcg, logUniform as logU } from './testRandom.js';
import { complexNodalSystem } from './testComplexNodal.js';

const cabs = (re: number, im: number) => Math.hypot(re, im);

function randomCircuit(r: () => number): AcCircuit {
  const mode = r();
  return {
    capCoupled: mode < 0.6,
    leakToGrid1: mode >= 0.8,
    ...{ mu1: logU(r, 5, 120), mu2: logU(r, 5, 120), rp1: logU(r, 2e3, 1e5), rp2: logU(r, 2e3, 1e5) },
    ...{ rl1: logU(r, 5e3, 3e5), rl2: logU(r, 5e3, 3e5), rk: logU(r, 50, 5e3), rt: logU(r, 1e3, 1e5) },
    ...{ rg1: logU(r, 1e5, 3e6), rg2: logU(r, 1e5, 3e6) },
    ...{ rload1: logU(r, 2e4, 1e6), rload2: logU(r, 2e4, 1e6), rsource: logU(r, 100, 1e5) },
    ...{
      cin: logU(r, 1e-9, 1e-6),
      cg2: logU(r, 1e-8, 1e-5),
      cout1: logU(r, 1e-9, 1e-6),
      cout2: logU(r, 1e-9, 1e-6),
    },
    ...{ cstray1: logU(r, 1e-12, 3e-10), cstray2: logU(r, 1e-12, 3e-10) },
    ...{ cgk1: logU(r, 1e-12, 4e-12), cgk2: logU(r, 1e-12, 4e-12), cgp1: logU(r, 1e-12, 4e-12) },
    ...{ cgp2: logU(r, 1e-12, 4e-12), cpk1: logU(r, 2e-13, 2e-12), cpk2: logU(r, 2e-13, 2e-12) },
  };
}

/**
 * An independent reference: plain modified nodal analysis written here from the element list
 * (the source, Rs, Cin, the load capacitors and loads all as their own nodes and branches, no
 * Norton forms), solved by mathjs's complex LU (lusolve).
 */
function mathjsResponse(c: AcCircuit, f: number): { h1: MathComplex; h2: MathComplex } {
  const [P1, P2, K, J, G1, G2, X, O1, O2, S, I] = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
  const { a, g, cap, transconductance, voltageSource, solve } = complexNodalSystem(11, f);
  g(P1, -1, c.rl1);
  g(P2, -1, c.rl2);
  cap(P1, O1, c.cout1);
  cap(P2, O2, c.cout2);
  g(O1, -1, c.rload1);
  g(O2, -1, c.rload2);
  cap(P1, -1, c.cstray1);
  cap(P2, -1, c.cstray2);
  g(P1, K, c.rp1);
  g(P2, K, c.rp2);
  transconductance(P1, K, G1, c.mu1 / c.rp1);
  transconductance(P2, K, G2, c.mu2 / c.rp2);
  cap(G1, K, c.cgk1);
  cap(G2, K, c.cgk2);
  cap(G1, P1, c.cgp1);
  cap(G2, P2, c.cgp2);
  cap(P1, K, c.cpk1);
  cap(P2, K, c.cpk2);
  g(K, J, c.rk);
  g(J, -1, c.rt);
  if (c.capCoupled) {
    g(G1, J, c.rg1);
    g(G2, J, c.rg2);
  } else if (c.leakToGrid1) g(G1, G2, c.rg2);
  if (c.capCoupled || c.leakToGrid1) cap(G2, -1, c.cg2);
  else g(G2, -1, 1e-300); // grid 2 held at AC ground below
  cap(X, G1, c.cin);
  g(S, X, c.rsource);
  voltageSource(S, I, 1);
  if (!(c.capCoupled || c.leakToGrid1)) {
    // Direct-coupled 'fixed': grid 2 is an ideal AC ground.
    a[G2] = a[G2].map(() => complex(0, 0));
    a[G2][G2] = complex(1, 0);
  }
  const x = solve();
  return { h1: x[O1], h2: x[O2] };
}

describe('complex solver', () => {
  it('solves random complex systems like mathjs lusolve (mathjs)', () => {
    const r = lcg(3);
    for (let t = 0; t < 200; t++) {
      const n = 1 + Math.floor(r() * 8);
      const rows = Array.from({ length: n }, () =>
        Array.from({ length: n }, () => complex(r() - 0.5, r() - 0.5)),
      );
      const rhs = Array.from({ length: n }, () => complex(r() - 0.5, r() - 0.5));
      const ref = lusolve(rows, rhs) as unknown as MathComplex[][];
      const a = new Float64Array(2 * n * n);
      rows.flat().forEach((z, i) => ((a[2 * i] = z.re), (a[2 * i + 1] = z.im)));
      const b = new Float64Array(2 * n);
      rhs.forEach((z, i) => ((b[2 * i] = z.re), (b[2 * i + 1] = z.im)));
      expect(solveComplexInPlace(a, b, n)).toBe(true);
      for (let i = 0; i < n; i++) {
        const z = complex(ref[i][0]);
        expect(cabs(b[2 * i] - z.re, b[2 * i + 1] - z.im)).toBeLessThan(1e-9 * cabs(z.re, z.im) + 1e-12);
      }
    }
  });

  it('refuses a singular system', () => {
    const a = Float64Array.of(1, 0, 2, 0, 2, 0, 4, 0);
    expect(solveComplexInPlace(a, new Float64Array(4), 2)).toBe(false);
  });
});

describe('acResponseArr', () => {
  it('matches an independent modified nodal analysis solved by mathjs on 1 000 random circuits and frequencies (mathjs)', () => {
    const r = lcg(11);
    let worst = 0;
    for (let t = 0; t < 1000; t++) {
      const c = randomCircuit(r);
      const f = logU(r, 1, 1e6);
      const got = acResponse(c, f);
      const ref = mathjsResponse(c, f);
      expect(got.ok).toBe(true);
      for (const [h, z] of [
        [got.h1, ref.h1],
        [got.h2, ref.h2],
      ] as const) {
        const e = cabs(h.re - z.re, h.im - z.im) / cabs(z.re, z.im);
        worst = Math.max(worst, e);
      }
    }
    expect(worst).toBeLessThan(1e-9);
  });

  it('reduces to the midband gains with ideal coupling and no capacitance (existing closed nodal form)', () => {
    const r = lcg(5);
    for (let t = 0; t < 300; t++) {
      const c = {
        ...randomCircuit(r),
        ...{ cin: Infinity, cg2: Infinity, cout1: Infinity, cout2: Infinity, cstray1: 0, cstray2: 0 },
        ...{ cgk1: 0, cgk2: 0, cgp1: 0, cgp2: 0, cpk1: 0, cpk2: 0 },
      };
      if (r() < 0.3) c.rsource = 0;
      if (r() < 0.3) c.rload1 = Infinity;
      const mid = reducedNodalGainsInto(c, createStageGains());
      const h = acResponse(c, logU(r, 1, 1e6));
      expect(h.h1.re).toBeCloseTo(mid.a11, 9);
      expect(Math.abs(h.h1.re / mid.a11 - 1)).toBeLessThan(1e-9);
      expect(Math.abs(h.h2.re / mid.a12 - 1)).toBeLessThan(1e-9);
      expect(Math.abs(h.h1.im)).toBeLessThan(1e-12 * Math.abs(mid.a11));
    }
  });

  it('puts the low corner of a coupling capacitor into a grid resistor at 1/(2π·C·(R + Zout)) (single-pole RC, analytic)', () => {
    const r = lcg(9);
    for (let t = 0; t < 50; t++) {
      const c = {
        ...randomCircuit(r),
        ...{ cin: Infinity, cg2: Infinity, cout2: Infinity, cstray1: 0, cstray2: 0, rsource: 0 },
        ...{ cgk1: 0, cgk2: 0, cgp1: 0, cgp2: 0, cpk1: 0, cpk2: 0 },
      };
      const mid = reducedNodalGainsInto(c, createStageGains());
      // The plate is a Thevenin source behind Zout1 (load removed): C sees Rload1 + Zout1.
      const expected = 1 / (2 * Math.PI * c.cout1 * (c.rload1 + mid.zout1));
      const v = new Float64Array(AC_SLOTS);
      writeAcCircuit(c, v);
      const h = new Float64Array(H_SLOTS);
      const f = cornerFrequencyArr(
        pairAcSolver(c.capCoupled, c.leakToGrid1),
        v,
        1,
        Math.abs(mid.a11),
        'low',
        1e4,
        0,
        h,
      );
      expect(Math.abs(f / expected - 1)).toBeLessThan(1e-7);
    }
  });

  it('loads grid 1 with Cgk + (1 + |A|)·Cgp, the Miller capacitance (standard textbook formula)', () => {
    // Grounded-cathode section (Rk, Rt tiny), driven through a large source resistance: the high
    // corner is the source resistance against the Miller capacitance, the plate pole ~1000× higher.
    const base = {
      ...{ capCoupled: true, leakToGrid1: false, mu1: 100, mu2: 100, rp1: 62.5e3, rp2: 62.5e3 },
      ...{
        rl1: 100e3,
        rl2: 100e3,
        rk: 1e-6,
        rt: 1e-6,
        rg1: 1e12,
        rg2: 1e12,
        rload1: Infinity,
        rload2: Infinity,
      },
      ...{
        rsource: 1e6,
        cin: Infinity,
        cg2: Infinity,
        cout1: Infinity,
        cout2: Infinity,
        cstray1: 0,
        cstray2: 0,
      },
      ...{ cgk1: 1.6e-12, cgk2: 1.6e-12, cgp1: 1.7e-12, cgp2: 1.7e-12, cpk1: 0, cpk2: 0 },
    };
    const gain = (base.mu1 * base.rl1) / (base.rp1 + base.rl1);
    const miller = base.cgk1 + (1 + gain) * base.cgp1;
    const expected = 1 / (2 * Math.PI * base.rsource * miller);
    const v = new Float64Array(AC_SLOTS);
    writeAcCircuit(base, v);
    const h = new Float64Array(H_SLOTS);
    const f = cornerFrequencyArr(pairAcSolver(true, false), v, 1, gain, 'high', 10, 0, h);
    // Two poles a factor ~1000 apart move the corner by ~0.1 %.
    expect(Math.abs(f / expected - 1)).toBeLessThan(5e-3);
  });
});
