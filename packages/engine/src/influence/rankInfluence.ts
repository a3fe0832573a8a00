/**
 * Ranks 1..n of col[0..n) with ties given their average rank.
 *
 * @example rankInPlace(Float64Array.of(3, 1, 3), out) // out = [2.5, 1, 2.5]
 */
export function rankInPlace(col: Float64Array, out: Float64Array): void {
  const n = col.length;
  const order = Uint32Array.from({ length: n }, (_v, i) => i).sort((a, b) => col[a] - col[b]);
  for (let i = 0; i < n;) {
    let j = i;
    while (j + 1 < n && col[order[j + 1]] === col[order[i]]) j++;
    const r = (i + j) / 2 + 1;
    for (let k = i; k <= j; k++) out[order[k]] = r;
    i = j + 1;
  }
}

/** Pearson correlation of two equal-length columns; NaN if either is constant. */
export function correlation(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i];
    mb += b[i];
  }
  ma /= n;
  mb /= n;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    const da = a[i] - ma;
    const db = b[i] - mb;
    sab += da * db;
    saa += da * da;
    sbb += db * db;
  }
  return sab / Math.sqrt(saa * sbb);
}

/**
 * Solves A·x = b (A square, row-major arrays) by Gaussian elimination with partial pivoting.
 * Returns null when A is singular to working precision (e.g. two inputs drawn identical).
 */
export function solveLinear(a: number[][], b: number[]): number[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    if (!(Math.abs(m[p][c]) > 1e-10)) return null;
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = c + 1; r < n; r++) {
      const f = m[r][c] / m[c][c];
      for (let k = c; k <= n; k++) m[r][k] -= f * m[c][k];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let k = r + 1; k < n; k++) s -= m[r][k] * x[k];
    x[r] = s / m[r][r];
  }
  return x;
}

/**
 * Spearman rank correlations and standardised rank regression coefficients (SRRC) of one output
 * against several inputs, all given as rank columns. On standardised ranks the regression
 * coefficients solve R_xx·β = r_xy (R_xx: rank correlations among inputs, r_xy: Spearman
 * vector), so no n×k design matrix is built. SRRC is null if R_xx is singular.
 */
export function rankRegression(
  inputRanks: readonly Float64Array[],
  outputRanks: Float64Array,
): { spearman: (number | null)[]; srrc: (number | null)[] } {
  const k = inputRanks.length;
  const rxy = inputRanks.map((x) => correlation(x, outputRanks));
  const spearman = rxy.map((r) => (Number.isFinite(r) ? r : null));
  if (rxy.some((r) => !Number.isFinite(r))) return { spearman, srrc: spearman.map(() => null) };
  const rxx = inputRanks.map((a, i) => inputRanks.map((b, j) => (i === j ? 1 : correlation(a, b))));
  const beta = k > 0 ? solveLinear(rxx, rxy) : [];
  return { spearman, srrc: beta ? beta : spearman.map(() => null) };
}
