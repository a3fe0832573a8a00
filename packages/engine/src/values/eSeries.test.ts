import { describe, expect, it } from 'vitest';
import { E_SERIES, eSeriesNeighbours, snapToSeries } from './eSeries.js';

describe('IEC 60063 series', () => {
  it('E24 and E12 match the standard table', () => {
    // IEC 60063 E24 list; note 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2 are not the rounded geometric values.
    expect(E_SERIES.E24).toEqual([
      1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8,
      7.5, 8.2, 9.1,
    ]);
    expect(E_SERIES.E12).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
  });

  it('E24 deviates from the rounded geometric series exactly where IEC 60063 says', () => {
    const off = E_SERIES.E24.filter((v, i) => v !== Math.round(10 * 10 ** (i / 24)) / 10);
    expect(off).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]);
  });

  it('E192/E96/E48 follow the three-digit table; E192 differs from rounding only at 9.20', () => {
    // IEC 60063: E192 rounds 10^(i/192) to three digits except 9.20 (computed 9.19).
    expect(E_SERIES.E192).toHaveLength(192);
    const off = E_SERIES.E192.filter((v, i) => v !== Math.round(100 * 10 ** (i / 192)) / 100);
    expect(off).toEqual([9.2]);
    expect(E_SERIES.E96).toHaveLength(96);
    expect(E_SERIES.E48).toHaveLength(48);
    expect(E_SERIES.E96.slice(0, 6)).toEqual([1.0, 1.02, 1.05, 1.07, 1.1, 1.13]);
    expect(E_SERIES.E48.slice(0, 6)).toEqual([1.0, 1.05, 1.1, 1.15, 1.21, 1.27]);
    expect(E_SERIES.E96).toContain(9.09);
    expect(E_SERIES.E96.at(-1)).toBe(9.76);
  });

  it('snaps to the nearest value on a log scale and finds neighbours across decades', () => {
    expect(snapToSeries(4800, 'E24')).toBe(4700);
    expect(snapToSeries(94190, 'E24')).toBe(91000);
    expect(snapToSeries(94190, 'E96')).toBe(93100);
    expect(snapToSeries(9.6e3, 'E12')).toBe(10000);
    expect(eSeriesNeighbours(1000, 'E24')).toEqual({ below: 1000, above: 1000 });
    expect(eSeriesNeighbours(999.9, 'E96')).toEqual({ below: 976, above: 1000 });
    expect(eSeriesNeighbours(0.47, 'E12')).toEqual({ below: 0.47, above: 0.47 });
    expect(() => snapToSeries(-1, 'E24')).toThrow();
  });
});
