import { describe, expect, it } from 'vitest';
import { TUBE_CATALOG } from './tubeCatalog.js';
import { korenCurrent, korenPointInto } from './korenTriode.js';
import { TUBE_TYPES } from './tubeTypes.js';

// Tolerances against the datasheet typical point. The published Koren sets were fitted to whole
// plate-curve families, not to this one point, so they miss it by up to ~30 % (12AT7: +28 % Ia).
// The sets fitted here to the typical point must land within 1 %.
const TOLERANCE: Record<string, { ia: number; gm: number }> = {
  '12AX7': { ia: 0.25, gm: 0.1 },
  '12AT7': { ia: 0.3, gm: 0.35 },
  '12AU7': { ia: 0.05, gm: 0.15 },
  '12AY7': { ia: 0.01, gm: 0.01 },
  '12BH7': { ia: 0.01, gm: 0.01 },
  '6SN7': { ia: 0.01, gm: 0.01 },
};

describe('tube catalog against datasheet typical points (RCA/GE datasheet figures, from memory)', () => {
  it.each(TUBE_TYPES)('%s: plate current and gm at the typical point', (type) => {
    const t = TUBE_CATALOG[type];
    const pt = korenPointInto(t.model, t.typical.va, t.typical.vg, 1, 1, { ia: 0, gm: 0, ga: 0 });
    expect(Math.abs(pt.ia / t.typical.ia - 1)).toBeLessThan(TOLERANCE[type].ia);
    expect(Math.abs(pt.gm / t.typical.gm - 1)).toBeLessThan(TOLERANCE[type].gm);
    // mu = gm·rp stays within 20 % of the datasheet mu for every type.
    expect(Math.abs(pt.gm / pt.ga / t.typical.mu - 1)).toBeLessThan(0.2);
  });

  it('the (1 + sgn(E1)) factor of the published current law is what matches the datasheets', () => {
    // Without the factor 2 the 12AX7 set gives 0.48 mA at 250 V / −2 V against a datasheet 1.2 mA.
    const t = TUBE_CATALOG['12AX7'];
    const ia = korenCurrent(t.model, 250, -2);
    expect(Math.abs(ia / 1.2e-3 - 1)).toBeLessThan(0.25);
    expect(Math.abs(ia / 2 / 1.2e-3 - 1)).toBeGreaterThan(0.5);
  });

  it('agrees with a worked 12AX7 stage solved with the Koren 12AX7 set (from memory)', () => {
    // A worked 12AX7 stage solved with Koren's 12AX7 parameters finds
    // Ia = 1.07 mA at Va = 221 V, Vg = −1.61 V, with gm = 1880 µS; only the factor-2 law gives this.
    const pt = korenPointInto(TUBE_CATALOG['12AX7'].model, 221, -1.61, 1, 1, { ia: 0, gm: 0, ga: 0 });
    // The example quotes three figures, so agree to its rounding (1 %).
    expect(Math.abs(pt.ia / 1.07e-3 - 1)).toBeLessThan(0.01);
    expect(Math.abs(pt.gm / 1.88e-3 - 1)).toBeLessThan(0.01);
  });

  it('every rating and capacitance carries a source', () => {
    for (const t of Object.values(TUBE_CATALOG)) {
      for (const s of [t.model.source, t.typical.source, t.maxPlateDissipation.source, t.capacitance.source])
        expect(s.length).toBeGreaterThan(5);
      expect(t.maxPlateDissipation.value).toBeGreaterThan(0);
    }
  });

  it('analytic gm and 1/rp equal finite differences of the current (analytic result)', () => {
    for (const type of TUBE_TYPES) {
      const m = TUBE_CATALOG[type].model;
      for (const [va, vg] of [
        [250, -2],
        [120, -0.5],
        [300, -12],
        [80, -4],
      ]) {
        const pt = korenPointInto(m, va, vg, 1.1, 0.95, { ia: 0, gm: 0, ga: 0 });
        const h = 1e-4;
        const gm =
          (korenCurrent(m, va, vg + h, 1.1, 0.95) - korenCurrent(m, va, vg - h, 1.1, 0.95)) / (2 * h);
        const ga =
          (korenCurrent(m, va + h, vg, 1.1, 0.95) - korenCurrent(m, va - h, vg, 1.1, 0.95)) / (2 * h);
        expect(pt.ia).toBeCloseTo(korenCurrent(m, va, vg, 1.1, 0.95), 15);
        expect(pt.gm / gm).toBeCloseTo(1, 6);
        expect(pt.ga / ga).toBeCloseTo(1, 6);
      }
    }
  });

  it('gives no current at or below zero plate voltage', () => {
    expect(korenCurrent(TUBE_CATALOG['12AU7'].model, 0, -1)).toBe(0);
    expect(korenCurrent(TUBE_CATALOG['12AU7'].model, -5, 0)).toBe(0);
  });
});
