// Minimal types for the parts of jstat the tests use as an independent reference.
declare module 'jstat' {
  const jStat: { normal: { cdf(x: number, mean: number, sd: number): number } };
  export default jStat;
}
