import { describe, expect, it } from 'vitest';
import { createBiasPoint, solveBiasBracketedInto, solveBiasInto, type BiasCircuit } from './biasSolver.js';
import { TUBE_TYPES } from '../tubes/tubeTypes.js';
import { korenCurrent } from '../tubes/korenTriode.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';

const circuit = (over: Partial<BiasCircuit> = {}): BiasCircuit => ({
  ...{ capCoupled: true, bPlus: 320, tail: 0, vg1: 0, vg2: 0, rl1: 82e3, rl2: 100e3, rk: 470, rt: 10e3 },
  ...{ tube: TUBE_CATALOG['12AX7'].model, perv1: 1, perv2: 1, muScale1: 1, muScale2: 1 },
  ...over,
});

/** Both section currents satisfy the model at the solved voltages, and the voltages satisfy Ohm's law. */
function expectConsistent(c: BiasCircuit, bp: ReturnType<typeof createBiasPoint>) {
  const i = bp.ia1 + bp.ia2;
  expect(bp.vk).toBeCloseTo(c.tail + i * (c.rk + c.rt), 9);
  expect(bp.va1).toBeCloseTo(c.bPlus - bp.ia1 * c.rl1, 9);
  const i1 = korenCurrent(c.tube, bp.va1 - bp.vk, bp.vgk1, c.perv1, c.muScale1);
  const i2 = korenCurrent(c.tube, bp.va2 - bp.vk, bp.vgk2, c.perv2, c.muScale2);
  expect(Math.abs(i1 / bp.ia1 - 1)).toBeLessThan(1e-9);
  expect(Math.abs(i2 / bp.ia2 - 1)).toBeLessThan(1e-9);
}

describe('solveBiasInto', () => {
  it('solves a cap-coupled 12AX7 pair: grids at J, Vgk = −I·Rk', () => {
    const c = circuit();
    const bp = createBiasPoint();
    expect(solveBiasInto(c, bp, false)).toBe('ok');
    expectConsistent(c, bp);
    expect(bp.vgk1).toBeCloseTo(-(bp.ia1 + bp.ia2) * c.rk, 12);
    expect(bp.ia1).toBeGreaterThan(bp.ia2); // smaller RL1 → higher plate voltage → more current
    expect(bp.iterations).toBeLessThan(15);
  });

  it('solves direct-coupled pairs with a negative tail and unequal sections', () => {
    for (const type of ['12AU7', '6SN7', '12BH7', '12AT7', '12AY7'] as const) {
      const c = circuit({
        capCoupled: false,
        tail: -150,
        vg1: 0,
        vg2: 0.5,
        rl1: 22e3,
        rl2: 22e3,
        rk: 1e3,
        rt: 15e3,
      });
      c.tube = TUBE_CATALOG[type].model;
      c.perv1 = 1.2;
      c.muScale2 = 0.9;
      const bp = createBiasPoint();
      expect(solveBiasInto(c, bp, false)).toBe('ok');
      expectConsistent(c, bp);
    }
  });

  it('warm start converges to the same point in few iterations', () => {
    const c = circuit();
    const bp = createBiasPoint();
    solveBiasInto(c, bp, false);
    const ref = { ...bp };
    c.rl1 *= 1.05;
    c.perv2 = 0.8;
    solveBiasInto(c, bp, false);
    const cold = { ...bp };
    bp.ia1 = ref.ia1;
    bp.ia2 = ref.ia2;
    solveBiasInto(c, bp, true);
    expect(bp.ia1).toBeCloseTo(cold.ia1, 14);
    expect(bp.iterations).toBeLessThanOrEqual(6);
  });

  it('diagnoses a supply too low, a cut-off section and grid current instead of returning NaN', () => {
    const bp = createBiasPoint();
    expect(solveBiasInto(circuit({ bPlus: -5 }), bp, false)).toBe('supply-too-low');
    expect(solveBiasInto(circuit({ bPlus: 100, tail: 200 }), bp, false)).toBe('supply-too-low');
    const cut = circuit({
      capCoupled: false,
      tail: -150,
      vg1: 0,
      vg2: -80,
      rl1: 22e3,
      rl2: 22e3,
      rk: 1e3,
      rt: 15e3,
    });
    cut.tube = TUBE_CATALOG['12AU7'].model;
    expect(solveBiasInto(cut, bp, false)).toBe('cut-off');
    const hot = circuit({ capCoupled: false, tail: 0, vg1: 60, vg2: 60, rk: 100, rt: 1e3 });
    expect(solveBiasInto(hot, bp, false)).toBe('grid-current');
    expect(bp.vgk1).toBeGreaterThan(0);
  });

  it('Newton agrees with the bracketing solve on 300 random circuits, statuses included', () => {
    let seed = 2026;
    const r = () => (seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 2 ** 32;
    const a = createBiasPoint();
    const b = createBiasPoint();
    const seen = new Set<string>();
    for (let n = 0; n < 300; n++) {
      const c = circuit({
        capCoupled: r() < 0.5,
        bPlus: 60 + 400 * r(),
        tail: r() < 0.5 ? 0 : -250 * r(),
        vg1: 60 * r() - 40,
        vg2: 60 * r() - 40,
        rl1: 10 ** (3 + 2.5 * r()),
        rl2: 10 ** (3 + 2.5 * r()),
        rk: 10 ** (1 + 3 * r()),
        rt: 10 ** (2 + 3 * r()),
        ...{
          perv1: 0.6 + 0.8 * r(),
          perv2: 0.6 + 0.8 * r(),
          muScale1: 0.8 + 0.4 * r(),
          muScale2: 0.8 + 0.4 * r(),
        },
      });
      c.tube = TUBE_CATALOG[TUBE_TYPES[n % TUBE_TYPES.length]].model;
      const sa = solveBiasInto(c, a, false);
      const sb = solveBiasBracketedInto(c, b);
      expect(sa).not.toBe('no-convergence');
      seen.add(sa);
      if (sa === 'ok' || sb === 'ok') {
        expect(sa).toBe(sb);
        expect(Math.abs(a.ia1 / b.ia1 - 1)).toBeLessThan(1e-8);
        expect(Math.abs(a.ia2 / b.ia2 - 1)).toBeLessThan(1e-8);
        expectConsistent(c, a);
      }
    }
    expect([...seen]).toEqual(expect.arrayContaining(['cut-off', 'grid-current', 'ok']));
  });
});
