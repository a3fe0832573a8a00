/** Whether a lot looks like parts with a tighter class picked out of the middle. */
export type BinnedVerdict = {
  looksBinned: boolean;
  /** Values within ±sd/4 of the mean. */
  centreCount: number;
  /** Mean count of the two flank windows (mean ± [sd/2, sd]) scaled to the centre's width. */
  flankCount: number;
  /** The widest empty interval between neighbouring values within mean ± sd, same unit as the values. */
  gap: { low: number; high: number };
  /** One sentence for the page. */
  reason: string;
};

/**
 * Hole-in-the-middle detector. A unimodal lot (normal, lognormal, uniform) has at least as many
 * values near its centre (the mean: a median sits on one edge of a hole, not in it) as in the windows half to one sd out; a lot from which the tighter class
 * was sorted out has almost none. Flags "binned" when the centre window (±sd/4, width sd/2) holds
 * under a third of the flank count per equal width, and the shortfall is over 3 Poisson standard
 * errors of the flank count (so a small lot is never flagged on noise).
 *
 * @example binnedVerdict(sortedValues, mean, sd).looksBinned
 */
export function binnedVerdict(sorted: Float64Array, centre: number, sd: number): BinnedVerdict {
  const count = (lo: number, hi: number) => upperBound(sorted, hi) - upperBound(sorted, lo);
  const centreCount = count(centre - sd / 4, centre + sd / 4);
  // The two flanks together are 2 × sd/2 wide: halve to compare with the centre's sd/2.
  const flankCount = (count(centre + sd / 2, centre + sd) + count(centre - sd, centre - sd / 2)) / 2;
  const shortfall = flankCount - centreCount;
  const looksBinned = centreCount < flankCount / 3 && shortfall > 3 * Math.sqrt(Math.max(flankCount, 1));
  let gap = { low: centre, high: centre };
  for (let i = 1; i < sorted.length; i++) {
    const a = sorted[i - 1];
    const b = sorted[i];
    if (b < centre - sd || a > centre + sd) continue;
    if (b - a > gap.high - gap.low) gap = { low: a, high: b };
  }
  const reason = looksBinned
    ? `few values near the mean (${centreCount} where about ${Math.round(flankCount)} were expected): ` +
      'parts of a tighter class look sorted out of this lot'
    : `no hole in the middle (${centreCount} values near the mean, ${Math.round(flankCount)} in each flank window)`;
  return { looksBinned, centreCount, flankCount, gap, reason };
}

/** Number of values <= x in an ascending array. */
function upperBound(a: Float64Array, x: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (a[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
