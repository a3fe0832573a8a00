import { describe, expect, it } from 'vitest';
import type { RunView } from '../api/types.js';
import { defaultDesign } from '../design/defaultDesign.js';
import { DISTORTION_OUTPUT_PEAK, latestDoneRun, splitterFigures } from './splitterFigures.js';

/** The engine example's 12AU7 cathodyne at 300 V (22k plate, 1k + 22k cathode, 220k loads). */
function splitLoad() {
  const d = { ...defaultDesign(), topology: 'split-load' as const, supply: { bPlus: 300, tail: 0 } };
  const part = (value: string) => ({ value, tolerance: 5, spread: { kind: 'normal' as const } });
  d.tube = { ...d.tube, type: '12AU7' };
  d.parts = { ...d.parts, rl1: part('22k'), rk: part('1k'), rt: part('22k'), rg1: part('1M') };
  Object.assign(d.parts, { rload1: part('220k'), rload2: part('220k'), rsource: part('33k') });
  return d;
}

describe('splitter figures', () => {
  it('a split-load design: plate and cathode gains a little below one in size, a low cathode Zout', () => {
    const f = splitterFigures(splitLoad());
    expect(f.topology).toBe('Split-load (cathodyne)');
    expect(f.problem).toBeNull();
    expect(f.gain1).toBeLessThan(-0.75);
    expect(f.gain1).toBeGreaterThan(-1);
    expect(f.gain2).toBeGreaterThan(0.75);
    expect(f.gain2).toBeLessThan(1);
    // Balance as the engine defines it: 20·log10(|A2|/|A1|).
    expect(f.balanceDb).toBeCloseTo(20 * Math.log10(Math.abs(f.gain2 / f.gain1)), 12);
    expect(f.zout2).toBeLessThan(f.zout1 / 5);
    // Large signal: tens of volts of swing on each output, low distortion at 20 V peak.
    expect(f.swing1).toBeGreaterThan(DISTORTION_OUTPUT_PEAK);
    expect(f.swing2).toBeGreaterThan(DISTORTION_OUTPUT_PEAK);
    expect(f.drive).toBeGreaterThan(DISTORTION_OUTPUT_PEAK);
    expect(f.thd1Percent).toBeGreaterThan(0);
    expect(f.thd2Percent).toBeLessThan(5);
  });

  it('a long-tailed pair: gains of opposite sign and tens in size', () => {
    const f = splitterFigures(defaultDesign());
    expect(f.topology).toMatch(/^Long-tailed pair/);
    expect(f.gain1 * f.gain2).toBeLessThan(0);
    expect(Math.abs(f.gain1)).toBeGreaterThan(5);
    // The same output level needs far less drive from a pair with gain.
    expect(f.drive).toBeLessThan(DISTORTION_OUTPUT_PEAK / 5);
    expect(f.thd2Percent).toBeGreaterThan(0);
  });

  it('says why there are no figures for a document that does not parse', () => {
    const f = splitterFigures({ format: 'other' });
    expect(f.problem).toBe('the design does not parse');
    expect(Number.isNaN(f.gain1)).toBe(true);
  });

  it('picks the most recently finished run that has a joint yield', () => {
    const run = (id: string, finishedAt: string | null, jointYield: number | null, status = 'done') =>
      ({ id, status, finishedAt, summary: { validCount: 1, jointYield } }) as RunView;
    expect(latestDoneRun([])).toBeNull();
    const runs = [
      run('a', '2026-01-01T00:00:00Z', 0.9),
      run('b', '2026-03-01T00:00:00Z', 0.95),
      run('c', '2026-04-01T00:00:00Z', null),
      run('d', '2026-05-01T00:00:00Z', 0.5, 'failed'),
    ];
    expect(latestDoneRun(runs)?.id).toBe('b');
  });
});
