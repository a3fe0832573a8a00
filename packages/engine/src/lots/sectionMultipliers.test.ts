import { describe, expect, it } from 'vitest';
import { korenPointInto } from '../tubes/korenTriode.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import { sectionMultipliers } from './sectionMultipliers.js';

describe('sectionMultipliers', () => {
  const model = TUBE_CATALOG['12AX7'].model;
  const at = { va: 250, vg: -2 };

  it('recovers the multipliers of a section from its Ia and gm at the test point (round trip)', () => {
    for (const [perv, mu] of [
      [1, 1],
      [1.15, 0.96],
      [0.8, 1.05],
    ] as const) {
      const pt = korenPointInto(model, at.va, at.vg, perv, mu, { ia: 0, gm: 0, ga: 0 });
      const got = sectionMultipliers(model, at, { quantity: 'ia-gm', ia: pt.ia, gm: pt.gm });
      expect(got.perv).toBeCloseTo(perv, 8);
      expect(got.mu).toBeCloseTo(mu, 8);
      const pt2 = korenPointInto(model, at.va, at.vg, perv, mu, { ia: 0, gm: 0, ga: 0 });
      const back = sectionMultipliers(model, at, { quantity: 'mu-rp', mu: pt2.gm / pt2.ga, rp: 1 / pt2.ga });
      expect(back.perv).toBeCloseTo(perv, 8);
      expect(back.mu).toBeCloseTo(mu, 8);
    }
  });

  it('reproduces the datasheet typical Ia and gm of a 12AX7 section (RCA data, from memory) exactly', () => {
    const t = TUBE_CATALOG['12AX7'].typical;
    const got = sectionMultipliers(model, at, { quantity: 'ia-gm', ia: t.ia, gm: t.gm });
    const pt = korenPointInto(model, at.va, at.vg, got.perv, got.mu, { ia: 0, gm: 0, ga: 0 });
    expect(pt.ia).toBeCloseTo(t.ia, 12);
    expect(pt.gm / t.gm).toBeCloseTo(1, 9);
  });

  it('refuses a measurement the model cannot reach, saying which', () => {
    expect(() => sectionMultipliers(model, at, { quantity: 'ia-gm', ia: 1e-3, gm: 1 })).toThrow(/gm\/Ia/);
    expect(() => sectionMultipliers(model, at, { quantity: 'mu-rp', mu: -3, rp: 1 })).toThrow(/positive/);
  });
});
