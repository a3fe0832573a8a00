import { describe, expect, it } from 'vitest';
import { createBiasPoint, type BiasCircuit } from './biasSolver.js';
import { solveSplitLoadBiasInto } from './splitLoadBias.js';
import { korenCurrent } from '../tubes/korenTriode.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';

const circuit = (over: Partial<BiasCircuit> = {}): BiasCircuit => ({
  ...{ capCoupled: true, bPlus: 300, tail: 0, vg1: 0, vg2: 0, rl1: 22e3, rl2: 22e3, rk: 1e3, rt: 22e3 },
  ...{ tube: TUBE_CATALOG['12AU7'].model, perv1: 1, perv2: 1, muScale1: 1, muScale2: 1 },
  ...over,
});

/**
 * Independent reference: the cathodyne's DC equation written here, Ia = Ip(Vpk, Vgk) with
 * Vpk = B+ − tail − Ia·(RL + Rb + Rt) and Vgk = −Ia·Rb (grid returned to J, no grid current),
 * solved by plain bisection on [0, (B+ − tail)/(RL + Rb + Rt)] (200 halvings).
 */
function bisectIa(c: BiasCircuit): number {
  const r = c.rl1 + c.rk + c.rt;
  const f = (ia: number) =>
    ia - korenCurrent(c.tube, c.bPlus - c.tail - ia * r, -ia * c.rk, c.perv1, c.muScale1);
  let lo = 0;
  let hi = (c.bPlus - c.tail) / r;
  for (let k = 0; k < 200; k++) {
    const m = 0.5 * (lo + hi);
    if (f(m) > 0) hi = m;
    else lo = m;
  }
  return 0.5 * (lo + hi);
}

describe('solveSplitLoadBiasInto', () => {
  it('equals a direct bisection of the DC equation for every catalog tube over a grid of circuits', () => {
    let n = 0;
    for (const type of Object.keys(TUBE_CATALOG) as (keyof typeof TUBE_CATALOG)[]) {
      for (const bPlus of [200, 300, 400])
        for (const rl1 of [10e3, 47e3, 100e3])
          for (const rk of [220, 1.5e3])
            for (const tail of [0, -50]) {
              const c = circuit({
                tube: TUBE_CATALOG[type].model,
                bPlus,
                tail,
                rl1,
                rt: rl1 - rk,
                rk,
                perv1: 1.1,
                muScale1: 0.95,
              });
              const bp = createBiasPoint();
              const status = solveSplitLoadBiasInto(c, bp, false);
              const ref = bisectIa(c);
              if (ref < 1e-6) continue;
              expect(status).toBe('ok');
              expect(Math.abs(bp.ia1 / ref - 1)).toBeLessThan(1e-9);
              expect(bp.vk).toBeCloseTo(tail + ref * (rk + c.rt), 6);
              expect(bp.vgk1).toBeCloseTo(-ref * rk, 9);
              expect(Number.isNaN(bp.ia2)).toBe(true);
              n++;
            }
    }
    expect(n).toBeGreaterThan(100);
  });

  it('gm and rp at the bias equal central differences of the Koren current', () => {
    const c = circuit();
    const bp = createBiasPoint();
    expect(solveSplitLoadBiasInto(c, bp, false)).toBe('ok');
    const vpk = bp.va1 - bp.vk;
    const h = 1e-3;
    const gm = (korenCurrent(c.tube, vpk, bp.vgk1 + h) - korenCurrent(c.tube, vpk, bp.vgk1 - h)) / (2 * h);
    const ga = (korenCurrent(c.tube, vpk + h, bp.vgk1) - korenCurrent(c.tube, vpk - h, bp.vgk1)) / (2 * h);
    expect(Math.abs(bp.gm1 / gm - 1)).toBeLessThan(1e-6);
    expect(Math.abs(bp.ga1 / ga - 1)).toBeLessThan(1e-6);
  });

  it('a warm start from the previous point lands on the same bias', () => {
    const bp = createBiasPoint();
    solveSplitLoadBiasInto(circuit(), bp, false);
    const cold = bp.ia1;
    solveSplitLoadBiasInto(circuit({ rl1: 24e3 }), bp, true);
    solveSplitLoadBiasInto(circuit(), bp, true);
    expect(Math.abs(bp.ia1 / cold - 1)).toBeLessThan(1e-10);
  });

  it('names why there is no bias: bad parts, no supply, bottomed plate', () => {
    const bp = createBiasPoint();
    expect(solveSplitLoadBiasInto(circuit({ rl1: -1 }), bp, false)).toBe('invalid-parts');
    expect(solveSplitLoadBiasInto(circuit({ bPlus: 0 }), bp, false)).toBe('supply-too-low');
    expect(solveSplitLoadBiasInto(circuit({ bPlus: 0.5, rk: 0 }), bp, false)).not.toBe('ok');
  });
});
