/** Parts that share one tolerance (± %) and spread shape, by part id and RKM value. */
function partsOf(tolerance: number, kind: 'normal' | 'uniform', values: Record<string, string>) {
  return Object.fromEntries(
    Object.entries(values).map(([id, value]) => [id, { value, tolerance, spread: { kind } }]),
  );
}

/** One capacitor: value (RKM/engineering text, farads), tolerance (± %) and spread shape. */
function cap(value: string, tolerance: number, kind: 'normal' | 'uniform') {
  return { value, tolerance, spread: { kind } };
}

// Capacitor tolerances, all from memory: film (polyester/polypropylene) coupling and bypass
// capacitors are commonly sold as ±10 % (K) or ±5 % (J); aluminium electrolytics as ±20 % (M),
// spread flat across the band; the stray and next-stage input capacitance is a wiring estimate
// (±30 %, flat), not a bought part.

/**
 * Demo designs of the fictional workshop, in the engine's design document format
 * ('sigmatail-design' version 2). Values are invented but typical of such stages.
 */
export const DEMO_DESIGNS: readonly Record<string, unknown>[] = [
  {
    format: 'sigmatail-design',
    version: 2,
    name: 'FL-50 driver: 12AX7 cap-coupled splitter',
    notes: 'Carbon-film loads, RL2 trimmed above RL1 to even out the outputs.',
    topology: 'cap-coupled',
    supply: { bPlus: 330, tail: 0 },
    tube: { type: '12AX7', spread: { perveanceSd: 10, muSd: 5, sectionCorrelation: 0.6 } },
    parts: {
      ...partsOf(5, 'normal', {
        rl1: '82k',
        rl2: '100k',
        rk: '1k',
        rt: '10k',
        rg1: '1M',
        rg2: '1M',
        rload1: '220k',
        rload2: '220k',
      }),
      // The notes' carbon-film plate loads (prices and ageing read the kind).
      rl1: { value: '82k', tolerance: 5, spread: { kind: 'normal' }, kind: 'carbon-film' },
      rl2: { value: '100k', tolerance: 5, spread: { kind: 'normal' }, kind: 'carbon-film' },
      cin: cap('22n', 10, 'normal'),
      cg2: cap('100n', 10, 'normal'),
      cout1: cap('22n', 10, 'normal'),
      cout2: cap('22n', 10, 'normal'),
      cstray1: cap('47p', 30, 'uniform'),
      cstray2: cap('47p', 30, 'uniform'),
    },
    specs: [
      // Balance, phase and CMRR limits are the invented workshop's own specs.
      { metric: 'balanceDb', min: -0.5, max: 0.5, label: 'Output balance' },
      { metric: 'acBalanceDb', frequency: 20000, min: -1, max: 1, label: 'Balance at 20 kHz' },
      { metric: 'acPhaseDeg', frequency: 20, min: -5, max: 5, label: 'Phase error at 20 Hz' },
      // 1 W per section is the 12AX7 plate dissipation rating: from memory.
      { metric: 'pd1', max: 1, label: 'Plate 1 dissipation' },
      { metric: 'pd2', max: 1, label: 'Plate 2 dissipation' },
    ],
  },
  {
    format: 'sigmatail-design',
    version: 2,
    name: 'Studio line driver: 12AT7 direct-coupled splitter',
    notes:
      'Grid 1 fed straight from the input stage plate; 1 % metal film; sections paired by gm; grid 2 bypassed by an electrolytic.',
    topology: 'direct-coupled',
    supply: { bPlus: 400, tail: 0 },
    drive: { grid1Dc: 90, grid2: { mode: 'leak-to-grid1' } },
    tube: {
      type: '12AT7',
      spread: { perveanceSd: 12, muSd: 6, sectionCorrelation: 0.5, pairing: { quantity: 'gm', within: 10 } },
    },
    parts: {
      ...partsOf(1, 'uniform', { rl1: '33k', rl2: '36k', rk: '220R', rt: '22k', rg1: '1M', rg2: '1M' }),
      ...partsOf(5, 'normal', { rload1: '100k', rload2: '100k' }),
      cg2: cap('10u', 20, 'uniform'),
      cout1: cap('470n', 5, 'normal'),
      cout2: cap('470n', 5, 'normal'),
      cstray1: cap('100p', 30, 'uniform'),
      cstray2: cap('100p', 30, 'uniform'),
    },
    specs: [
      { metric: 'balanceDb', min: -0.3, max: 0.3, label: 'Output balance' },
      { metric: 'acBalanceDb', frequency: 20000, min: -0.5, max: 0.5, label: 'Balance at 20 kHz' },
      { metric: 'acPhaseDeg', frequency: 20, min: -5, max: 5, label: 'Phase error at 20 Hz' },
      { metric: 'cmrrDb', min: 20, label: 'Common-mode rejection' },
    ],
  },
];
