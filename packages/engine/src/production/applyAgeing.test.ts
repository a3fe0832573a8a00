import { describe, expect, it } from 'vitest';
import { buildTestDesign } from '../run/buildTestDesign.js';
import { DEFAULT_AGEING_SCENARIO, type AgeingScenario } from './ageingScenario.js';
import { applyAgeing } from './applyAgeing.js';

const design = buildTestDesign();

describe('applyAgeing', () => {
  it('a scenario without drift leaves every unit as new', () => {
    const none: AgeingScenario = {
      name: 'none',
      resistors: {
        'metal-film': { shift: 0, sd: 0, source: 'test' },
        'carbon-film': { shift: 0, sd: 0, source: 'test' },
        'carbon-comp': { shift: 0, sd: 0, source: 'test' },
      },
      emission: { shift: 0, sd: 0, source: 'test' },
    };
    const r = applyAgeing(design, none, { samples: 2000 });
    expect(r.aged).toEqual(r.asNew);
  });

  it('emission loss lowers the plate current: less dissipation, and the margins move', () => {
    const r = applyAgeing(design, DEFAULT_AGEING_SCENARIO, { samples: 4000 });
    const pd = (side: typeof r.asNew) => side.specs.find((s) => s.metric === 'pd1')!;
    expect(pd(r.aged).mean).toBeLessThan(pd(r.asNew).mean);
    expect(pd(r.aged).margin).toBeGreaterThan(pd(r.asNew).margin);
    expect(r.asNew.specs).toHaveLength(design.specs.length);
    // Every figure of the default scenario says where it comes from.
    for (const d of [...Object.values(DEFAULT_AGEING_SCENARIO.resistors), DEFAULT_AGEING_SCENARIO.emission]) {
      expect(d.source).toBe('from memory');
    }
  });

  it('carbon composition drifts more than metal film (same units, scenario figures from memory)', () => {
    const cc = buildTestDesign({
      parts: { ...design.parts, rl1: { ...design.parts.rl1, kind: 'carbon-comp' } },
    });
    const mf = applyAgeing(design, DEFAULT_AGEING_SCENARIO, { samples: 3000 });
    const carbon = applyAgeing(cc, DEFAULT_AGEING_SCENARIO, { samples: 3000 });
    const bal = (r: typeof mf) => r.aged.specs.find((s) => s.metric === 'balanceDb')!;
    expect(Math.abs(bal(carbon).mean - bal(mf).mean)).toBeGreaterThan(0.1);
  });
});
