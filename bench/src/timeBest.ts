/**
 * Runs fn `reps` times after `warm` warm-up runs. Returns the best and median wall time and the
 * best CPU time of this process (user + system, ms). On a shared machine the CPU time is the
 * steadier per-core figure: time spent waiting for a core does not count.
 */
export function timeBest(fn: () => void, reps = 5, warm = 2): { best: number; median: number; cpu: number } {
  for (let i = 0; i < warm; i++) fn();
  const times: number[] = [];
  const cpus: number[] = [];
  for (let i = 0; i < reps; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpus.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  return { best: times[0], median: times[Math.floor(times.length / 2)], cpu: Math.min(...cpus) };
}
