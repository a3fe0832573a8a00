import type { Design } from '@sigmatail/engine';

/** The starting point of a new design: a common 12AX7 cap-coupled splitter with 5 % metal-film resistors. */
export function defaultDesign(): Design {
  const part = (value: string, tolerance = 5): Design['parts']['rl1'] => ({
    value,
    tolerance,
    spread: { kind: 'normal' },
  });
  return {
    format: 'sigmatail-design',
    version: 2,
    name: 'New splitter',
    notes: '',
    topology: 'cap-coupled',
    supply: { bPlus: 300, tail: 0 },
    tube: { type: '12AX7', spread: { perveanceSd: 10, muSd: 5, sectionCorrelation: 0.5 } },
    parts: {
      rl1: part('82k'),
      rl2: part('100k'),
      rk: part('1k'),
      rt: part('10k'),
      rg1: part('1M'),
      rg2: part('1M'),
    },
    specs: [{ metric: 'balanceDb', min: -0.5, max: 0.5, label: 'Output balance' }],
  };
}
