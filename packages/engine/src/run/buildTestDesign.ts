import type { ResolvedDesign } from '../design/designSchema.js';
import { parseDesign } from '../design/parseDesign.js';

/**
 * Test and bench fixture: a cap-coupled 12AX7 long-tailed pair of the fictional demo workshop,
 * with every spread kind represented. `overrides` replace top-level fields of the document.
 *
 * @example buildTestDesign({ specs: [] })
 */
export function buildTestDesign(overrides: Record<string, unknown> = {}): ResolvedDesign {
  const doc = {
    format: 'sigmatail-design',
    version: 2,
    name: 'Bench splitter',
    topology: 'cap-coupled',
    supply: { bPlus: 330, tail: 0 },
    tube: {
      type: '12AX7',
      spread: { perveanceSd: 10, muSd: 3, sectionCorrelation: 0.5, pairing: { quantity: 'ia', within: 15 } },
    },
    parts: {
      rl1: { value: '82k', tolerance: 5, spread: { kind: 'normal' } },
      rl2: { value: '100k', tolerance: 5, spread: { kind: 'truncnormal' } },
      rk: { value: '470R', tolerance: 5, spread: { kind: 'uniform' } },
      rt: { value: '10k', tolerance: 10, spread: { kind: 'binned', inner: 5 } },
      rg1: { value: '1M', tolerance: 10, spread: { kind: 'lognormal' } },
      rg2: { value: '1M', tolerance: 0, spread: { kind: 'fixed' } },
      rload1: {
        value: '220k',
        tolerance: 5,
        spread: { kind: 'empirical', values: [212e3, 218e3, 221e3, 224e3, 229e3] },
      },
      rload2: { value: '220k', tolerance: 5, spread: { kind: 'normal', k: 2 } },
    },
    specs: [
      { metric: 'balanceDb', min: -1, max: 1, label: 'balance' },
      { metric: 'gainDiff', max: -52 },
      { metric: 'pd1', max: 1 },
    ],
    ...overrides,
  };
  const r = parseDesign(doc);
  if (!r.ok) throw new Error(`test design invalid: ${JSON.stringify(r.errors)}`);
  return r.design;
}
