/** Runs fn `reps` times after `warm` warm-up runs; returns best and median wall time in ms. */
export function timeBest(fn: () => void, reps = 5, warm = 2): { best: number; median: number } {
  for (let i = 0; i < warm; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < reps; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { best: times[0], median: times[Math.floor(times.length / 2)] };
}
