const cap = (value: string, tolerance: number, kind = 'normal') => ({ value, tolerance, spread: { kind } });

/**
 * The capacitor parts the benches add to the engine's bench design: film coupling and bypass
 * capacitors (±10 %) and stray capacitance (±30 %, uniform).
 */
export const BENCH_CAPACITORS = {
  cin: cap('22n', 10),
  cg2: cap('100n', 10),
  cout1: cap('22n', 10),
  cout2: cap('22n', 10),
  cstray1: cap('47p', 30, 'uniform'),
  cstray2: cap('47p', 30, 'uniform'),
};
