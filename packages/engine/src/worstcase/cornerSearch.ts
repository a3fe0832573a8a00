/**
 * Coordinate ascent over corners: from `start` (one bit per input: 0 = low, 1 = high), flip single
 * bits while dir·f improves, until a full pass finds no improvement (at most 20 passes). Finds a
 * local extreme; for monotone metrics it is the global one. NaN values never count as better.
 *
 * @example cornerSearch((b) => b[0] - b[1], [0, 0], 1) // { bits: [1, 0], value: 1, ... }
 */
export function cornerSearch(
  f: (bits: number[]) => number,
  start: readonly number[],
  dir: 1 | -1,
): { bits: number[]; value: number; evaluations: number } {
  const bits = [...start];
  let value = f(bits);
  let evaluations = 1;
  for (let pass = 0; pass < 20; pass++) {
    let improved = false;
    for (let k = 0; k < bits.length; k++) {
      bits[k] ^= 1;
      const v = f(bits);
      evaluations++;
      if (dir * v > dir * value || (!Number.isFinite(value) && Number.isFinite(v))) {
        value = v;
        improved = true;
      } else bits[k] ^= 1;
    }
    if (!improved) break;
  }
  return { bits, value, evaluations };
}
