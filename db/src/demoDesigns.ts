/**
 * Demo designs of the fictional workshop, in the engine's design document format
 * ('sigmatail-design' version 1). Values are invented but typical of such stages.
 */
export const DEMO_DESIGNS: readonly Record<string, unknown>[] = [
  {
    format: 'sigmatail-design',
    version: 1,
    name: 'FL-50 driver: 12AX7 cap-coupled splitter',
    notes: 'Carbon-film loads, RL2 trimmed above RL1 to even out the outputs.',
    topology: 'cap-coupled',
    supply: { bPlus: 330, tail: 0 },
    tube: { type: '12AX7', spread: { perveanceSd: 10, muSd: 5, sectionCorrelation: 0.6 } },
    parts: {
      rl1: { value: '82k', tolerance: 5, spread: { kind: 'normal' } },
      rl2: { value: '100k', tolerance: 5, spread: { kind: 'normal' } },
      rk: { value: '1k', tolerance: 5, spread: { kind: 'normal' } },
      rt: { value: '10k', tolerance: 5, spread: { kind: 'normal' } },
      rg1: { value: '1M', tolerance: 5, spread: { kind: 'normal' } },
      rg2: { value: '1M', tolerance: 5, spread: { kind: 'normal' } },
      rload1: { value: '220k', tolerance: 5, spread: { kind: 'normal' } },
      rload2: { value: '220k', tolerance: 5, spread: { kind: 'normal' } },
    },
    specs: [
      // Balance and CMRR limits are the invented workshop's own specs.
      { metric: 'balanceDb', min: -0.5, max: 0.5, label: 'Output balance' },
      // 1 W per section is the 12AX7 plate dissipation rating: from memory.
      { metric: 'pd1', max: 1, label: 'Plate 1 dissipation' },
      { metric: 'pd2', max: 1, label: 'Plate 2 dissipation' },
    ],
  },
  {
    format: 'sigmatail-design',
    version: 1,
    name: 'Studio line driver: 12AT7 direct-coupled splitter',
    notes: 'Grid 1 fed straight from the input stage plate; 1 % metal film; sections paired by gm.',
    topology: 'direct-coupled',
    supply: { bPlus: 400, tail: 0 },
    drive: { grid1Dc: 90, grid2: { mode: 'leak-to-grid1' } },
    tube: {
      type: '12AT7',
      spread: { perveanceSd: 12, muSd: 6, sectionCorrelation: 0.5, pairing: { quantity: 'gm', within: 10 } },
    },
    parts: {
      rl1: { value: '33k', tolerance: 1, spread: { kind: 'uniform' } },
      rl2: { value: '36k', tolerance: 1, spread: { kind: 'uniform' } },
      rk: { value: '220R', tolerance: 1, spread: { kind: 'uniform' } },
      rt: { value: '22k', tolerance: 1, spread: { kind: 'uniform' } },
      rg1: { value: '1M', tolerance: 1, spread: { kind: 'uniform' } },
      rg2: { value: '1M', tolerance: 1, spread: { kind: 'uniform' } },
    },
    specs: [
      { metric: 'balanceDb', min: -0.3, max: 0.3, label: 'Output balance' },
      { metric: 'cmrrDb', min: 20, label: 'Common-mode rejection' },
    ],
  },
];
