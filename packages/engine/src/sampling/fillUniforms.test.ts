import { describe, expect, it } from 'vitest';
import { fillUniforms } from './fillUniforms.js';
import { sobolDirections } from './sobolDirections.js';

function columns(d: number, n: number): Float64Array[] {
  return Array.from({ length: d }, () => new Float64Array(n));
}

describe('sampling plans', () => {
  it('Sobol directions reproduce the first points of the Joe–Kuo sequence', () => {
    // Unshifted points 0..7 in dimensions 1 and 2 of the Sobol sequence in Gray-code order (from
    // memory; dimension 2 uses the Joe & Kuo new-joe-kuo-6.21201 entry s = 1, a = 0, m = 1):
    // (0,0) (.5,.5) (.75,.25) (.25,.75) (.375,.375) (.875,.875) (.625,.125) (.125,.625).
    const v = sobolDirections(2);
    const x = [0, 0];
    const pts: number[][] = [[0, 0]];
    for (let i = 0; i < 7; i++) {
      let c = 0;
      while ((i >>> c) & 1) c++;
      for (let j = 0; j < 2; j++) x[j] = (x[j] ^ v[j][c]) >>> 0;
      pts.push(x.map((y) => y / 2 ** 32));
    }
    expect(pts).toEqual([
      [0, 0],
      [0.5, 0.5],
      [0.75, 0.25],
      [0.25, 0.75],
      [0.375, 0.375],
      [0.875, 0.875],
      [0.625, 0.125],
      [0.125, 0.625],
    ]);
  });

  it('Sobol: each of 2^10 points falls in its own 1/1024 stratum per dimension (digital shift keeps the net)', () => {
    const n = 1024;
    const u = columns(13, n);
    fillUniforms('sobol', 'net', 0, 0, n, u);
    for (const col of u) expect(new Set(Array.from(col, (x) => Math.floor(x * n))).size).toBe(n);
  });

  it('Sobol: starting at any absolute index continues the same sequence', () => {
    const whole = columns(5, 300);
    fillUniforms('sobol', 's', 0, 0, 300, whole);
    const tail = columns(5, 123);
    fillUniforms('sobol', 's', 7, 177, 123, tail);
    for (let j = 0; j < 5; j++) expect(Array.from(tail[j])).toEqual(Array.from(whole[j].subarray(177)));
  });

  it('Latin hypercube: one draw per stratum in every dimension of a chunk', () => {
    const n = 5000;
    const u = columns(4, n);
    fillUniforms('lhs', 'lhs', 3, 3 * n, n, u);
    for (const col of u) {
      expect(new Set(Array.from(col, (x) => Math.floor(x * n))).size).toBe(n);
      expect(col.every((x) => x > 0 && x < 1)).toBe(true);
    }
  });

  it('random: chunks draw from their own streams; open interval; reproducible', () => {
    const a = columns(2, 1000);
    const b = columns(2, 1000);
    const c = columns(2, 1000);
    fillUniforms('random', 'r', 0, 0, 1000, a);
    fillUniforms('random', 'r', 0, 0, 1000, b);
    fillUniforms('random', 'r', 1, 1000, 1000, c);
    expect(a).toEqual(b);
    expect(a[0]).not.toEqual(c[0]);
    expect(a[0]).not.toEqual(a[1]);
    expect(a.every((col) => col.every((x) => x > 0 && x < 1))).toBe(true);
  });
});
