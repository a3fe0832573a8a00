// Types for the parts of jstat (an independent statistics library, test-only) the tests use.
declare module 'jstat' {
  type Dist2 = {
    pdf(x: number, a: number, b: number): number;
    cdf(x: number, a: number, b: number): number;
    inv(p: number, a: number, b: number): number;
    mean(a: number, b: number): number;
    variance(a: number, b: number): number;
  };
  const jStat: {
    normal: Dist2;
    uniform: Dist2;
    lognormal: Dist2;
    beta: Dist2;
    studentt: { inv(p: number, df: number): number; cdf(x: number, df: number): number };
    ibeta(x: number, a: number, b: number): number;
    gammaln(x: number): number;
    percentile(x: number[], p: number): number;
  };
  export default jStat;
}

// Types for @stdlib/stats-kstest (an independent statistics library, test-only).
declare module '@stdlib/stats-kstest' {
  function kstest(
    x: ArrayLike<number>,
    dist: string,
    ...params: number[]
  ): { statistic: number; pValue: number; rejected: boolean };
  export default kstest;
}
