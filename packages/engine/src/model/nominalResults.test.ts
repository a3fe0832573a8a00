import { describe, expect, it } from 'vitest';
import { buildDesign } from '../design/exampleDesign.js';
import { nominalResults } from './nominalResults.js';
import { trimRl2 } from './trimRl2.js';
import { E_SERIES } from '../values/eSeries.js';

const inSeries = (v: number, s: readonly number[]) =>
  s.some((m) => Math.abs(v / 10 ** Math.floor(Math.log10(v)) - m) < 1e-9);

describe('nominalResults', () => {
  it('reports the bias point, small signal and trim of a sound design', () => {
    const r = nominalResults(buildDesign());
    expect(r.status).toBe('ok');
    expect(r.metrics.ia1).toBeGreaterThan(0.5e-3);
    expect(r.metrics.a11).toBeLessThan(0);
    expect(r.metrics.a12).toBeGreaterThan(0);
    expect(r.metrics.zin).toBeGreaterThan(1e6); // bootstrapped 1 MΩ leak
    expect(r.warnings).toEqual([]);
    // RCA 12AX7 maximum ratings as recorded in the catalog (from memory).
    expect(r.ratings).toEqual({ plateDissipation: 1, plateVoltage: 330, heaterCathode: 180 });
    expect(r.trim).toBeDefined();
  });

  it('flags ratings: dissipation, plate voltage and heater–cathode voltage above the datasheet maximum', () => {
    const hot = buildDesign({
      tube: { type: '12AU7', spread: { perveanceSd: 10, muSd: 3, sectionCorrelation: 0 } },
    });
    hot.supply = { bPlus: 400, tail: 0, heater: -200 };
    hot.parts.rl1.value = hot.parts.rl2!.value = 10e3;
    hot.parts.rk.value = 150;
    hot.parts.rt.value = 1e3;
    const codes = nominalResults(hot).warnings.map((w) => w.code);
    expect(codes).toContain('plate-dissipation');
    expect(codes).toContain('supply-above-plate-rating');
    expect(codes).toContain('heater-cathode');
  });

  it('diagnoses a design with no bias point instead of returning NaN silently', () => {
    const grid = nominalResults(
      buildDesign({ topology: 'direct-coupled', drive: { grid1Dc: 150, grid2: { mode: 'fixed', dc: 150 } } }),
    );
    expect(grid.status).toBe('grid-current');
    expect(grid.diagnosis).toMatch(/grid/);
    expect(grid.metrics.valid).toBe(0);
    const cut = buildDesign({
      topology: 'direct-coupled',
      supply: { bPlus: 300, tail: -150 },
      drive: { grid1Dc: 0, grid2: { mode: 'fixed', dc: -120 } },
    });
    cut.parts.rt.value = 100e3;
    expect(nominalResults(cut).status).toBe('cut-off');
  });
});

describe('trimRl2', () => {
  it('finds the RL2 that zeroes the imbalance and the nearest E24/E96 values', () => {
    const d = buildDesign();
    d.parts.rload1 = { value: 220e3, tolerance: 5, spread: { kind: 'normal' } };
    d.parts.rload2 = { value: 220e3, tolerance: 5, spread: { kind: 'normal' } };
    const t = trimRl2(d);
    expect(Math.abs(t.exact.balanceDb)).toBeLessThan(1e-9);
    expect(inSeries(t.e24.rl2, E_SERIES.E24)).toBe(true);
    expect(inSeries(t.e96.rl2, E_SERIES.E96)).toBe(true);
    expect(Math.abs(t.e96.balanceDb)).toBeLessThanOrEqual(Math.abs(t.e24.balanceDb) + 1e-12);
    // The balanced RL2 sits above RL1: the tail's finite impedance starves output 2 (BRIEF balance formula).
    expect(t.exact.rl2).toBeGreaterThan(d.parts.rl1.value);
  });
});
