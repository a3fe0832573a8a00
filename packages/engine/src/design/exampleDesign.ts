import type { ResolvedDesign } from './designSchema.js';

const part = (value: number, tolerance = 5) => ({ value, tolerance, spread: { kind: 'normal' as const } });

/**
 * A valid resolved design (cap-coupled 12AX7 splitter) with overrides, for tests, docs and the
 * web editor's "new design" form.
 *
 * @example
 * buildDesign({ supply: { bPlus: 300, tail: 0 } }).parts.rl1.value; // 82000
 */
export function buildDesign(overrides: Partial<ResolvedDesign> = {}): ResolvedDesign {
  return {
    format: 'sigmatail-design',
    version: 2,
    name: 'New splitter',
    topology: 'cap-coupled',
    supply: { bPlus: 320, tail: 0 },
    tube: { type: '12AX7', spread: { perveanceSd: 10, muSd: 3, sectionCorrelation: 0.5 } },
    parts: {
      rl1: part(82e3),
      rl2: part(100e3),
      rk: part(470),
      rt: part(10e3),
      rg1: part(1e6),
      rg2: part(1e6),
    },
    specs: [{ metric: 'balanceDb', min: -1, max: 1 }],
    ...overrides,
  };
}
