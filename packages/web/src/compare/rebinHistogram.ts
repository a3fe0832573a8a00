/**
 * Common bin edges for several histograms: `bins` equal bins spanning all of them.
 */
export function commonEdges(edgeSets: number[][], bins = 40): number[] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const e of edgeSets) {
    if (e.length < 2) continue;
    lo = Math.min(lo, e[0]);
    hi = Math.max(hi, e[e.length - 1]);
  }
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return [];
  if (lo === hi) {
    lo -= 0.5;
    hi += 0.5;
  }
  return Array.from({ length: bins + 1 }, (_, i) => lo + ((hi - lo) * i) / bins);
}

/**
 * Re-bins a histogram onto new edges, spreading each source bin's count uniformly over its width
 * (the only assumption available without the raw samples). Counts outside the new edges are dropped;
 * the total is otherwise preserved.
 */
export function rebinHistogram(edges: number[], counts: number[], target: number[]): number[] {
  const out = new Array<number>(Math.max(0, target.length - 1)).fill(0);
  let j = 0;
  for (let i = 0; i < counts.length; i++) {
    const a = edges[i];
    const b = edges[i + 1];
    const c = counts[i];
    if (!(c > 0)) continue;
    if (b <= a) {
      // A zero-width bin: put it where it sits.
      const k = target.findIndex((t, q) => q < out.length && a >= t && a < target[q + 1]);
      if (k >= 0) out[k] += c;
      continue;
    }
    while (j > 0 && target[j] > a) j--;
    for (let k = j; k < out.length; k++) {
      const lo = Math.max(a, target[k]);
      const hi = Math.min(b, target[k + 1]);
      if (target[k] >= b) break;
      if (hi > lo) out[k] += (c * (hi - lo)) / (b - a);
      j = k;
    }
  }
  return out;
}
