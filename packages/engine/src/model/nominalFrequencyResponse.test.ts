import { describe, expect, it } from 'vitest';
import { buildDesign } from '../design/exampleDesign.js';
import { createStagePoint } from './stagePoint.js';
import { nominalFrequencyResponse, PLOT_FREQUENCIES } from './nominalFrequencyResponse.js';

describe('nominalFrequencyResponse', () => {
  it('matches the kernel’s nominal frequency columns and the midband balance in the band', () => {
    const d = buildDesign();
    d.parts.cout1 = { value: 22e-9, tolerance: 10, spread: { kind: 'normal' } };
    d.parts.cout2 = { value: 22e-9, tolerance: 10, spread: { kind: 'normal' } };
    d.parts.rload1 = { value: 470e3, tolerance: 5, spread: { kind: 'normal' } };
    d.parts.rload2 = { value: 470e3, tolerance: 5, spread: { kind: 'normal' } };
    d.specs = [{ metric: 'acPhaseDeg', frequency: 20, min: -5, max: 5 }];
    const r = nominalFrequencyResponse(d, [20, 1000]);
    const m = createStagePoint(d)();
    expect(r.status).toBe('ok');
    expect(r.phaseDeg[0]).toBeCloseTo(m['acPhaseDeg@20'], 10);
    expect(r.balanceDb[0]).toBeCloseTo(m['acBalanceDb@20'], 10);
    expect(r.gain1Db[0]).toBeCloseTo(20 * Math.log10(m['acGain1@20']), 10);
    // At 1 kHz the coupling and the tube capacitances hardly matter.
    expect(r.balanceDb[1]).toBeCloseTo(m.balanceDb, 2);
    expect(r.gain2Db[1]).toBeCloseTo(20 * Math.log10(Math.abs(m.a12)), 2);
  });

  it('plots 1 Hz to 1 MHz by default and reports a design without bias', () => {
    expect(PLOT_FREQUENCIES[0]).toBe(1);
    expect(PLOT_FREQUENCIES[PLOT_FREQUENCIES.length - 1]).toBe(1e6);
    const r = nominalFrequencyResponse(buildDesign({ supply: { bPlus: -10, tail: 0 } }));
    expect(r.status).toBe('no-bias');
    expect(r.balanceDb).toEqual([]);
  });
});
