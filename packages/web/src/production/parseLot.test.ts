import { describe, expect, it } from 'vitest';
import { parseLot } from './parseLot.js';

describe('parseLot', () => {
  it('reads one envelope per line with any common separator, skipping blanks and comments', () => {
    expect(parseLot('# Ia, mA\n1.21, 1.18\n\n1.05 1.12\n0.9;0.95\n1\t2')).toEqual({
      ok: true,
      sections: [
        [1.21, 1.18],
        [1.05, 1.12],
        [0.9, 0.95],
        [1, 2],
      ],
    });
  });

  it('names the first bad line', () => {
    expect(parseLot('1, 2\n1, x\n')).toEqual({
      ok: false,
      line: 2,
      message: 'line 2: two positive numbers (section 1, section 2)',
    });
    expect(parseLot('1, 2, 3')).toMatchObject({ ok: false, line: 1 });
    expect(parseLot('0, 2')).toMatchObject({ ok: false, line: 1 });
    expect(parseLot('\n# only a comment\n')).toEqual({
      ok: false,
      line: 0,
      message: 'no envelope in the lot',
    });
  });
});
