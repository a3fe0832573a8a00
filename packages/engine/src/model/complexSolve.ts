/**
 * In place: solves the n×n complex system A·x = b by Gaussian elimination with partial pivoting
 * (pivot chosen by |re| + |im|). `a` holds the matrix row-major as interleaved (re, im) pairs
 * (a[2(i·n + j)] = Re A[i][j]), `b` the right-hand side as pairs; on return `b` holds x and `a`
 * is destroyed. Allocates nothing. Returns false when a pivot is zero or not finite.
 *
 * @example
 * const a = Float64Array.of(2, 0, 0, 1, 0, -1, 3, 0); // [[2, i], [−i, 3]]
 * const b = Float64Array.of(1, 0, 0, 0);
 * solveComplexInPlace(a, b, 2); // b = x, as (re, im) pairs
 */
export function solveComplexInPlace(a: Float64Array, b: Float64Array, n: number): boolean {
  for (let k = 0; k < n; k++) {
    // Pivot: the largest |re| + |im| in column k at or below row k.
    let p = k;
    let best = -1;
    for (let i = k; i < n; i++) {
      const t = 2 * (i * n + k);
      const m = Math.abs(a[t]) + Math.abs(a[t + 1]);
      if (m > best) {
        best = m;
        p = i;
      }
    }
    if (!(best > 0 && best < Number.POSITIVE_INFINITY)) return false;
    if (p !== k) {
      for (let j = 2 * k; j < 2 * n; j++) {
        const u = 2 * k * n + j;
        const w = 2 * p * n + j;
        const t = a[u];
        a[u] = a[w];
        a[w] = t;
      }
      const t0 = b[2 * k];
      const t1 = b[2 * k + 1];
      b[2 * k] = b[2 * p];
      b[2 * k + 1] = b[2 * p + 1];
      b[2 * p] = t0;
      b[2 * p + 1] = t1;
    }
    // 1 / pivot, once per column.
    const kk = 2 * (k * n + k);
    const pr = a[kk];
    const pi = a[kk + 1];
    const d = pr * pr + pi * pi;
    const ir = pr / d;
    const ii = -pi / d;
    for (let i = k + 1; i < n; i++) {
      const ik = 2 * (i * n + k);
      const xr = a[ik];
      const xi = a[ik + 1];
      if (xr === 0 && xi === 0) continue;
      // Row multiplier l = A[i][k] / A[k][k].
      const lr = xr * ir - xi * ii;
      const li = xr * ii + xi * ir;
      for (let j = k + 1; j < n; j++) {
        const kj = 2 * (k * n + j);
        const ij = 2 * (i * n + j);
        const cr = a[kj];
        const ci = a[kj + 1];
        a[ij] -= lr * cr - li * ci;
        a[ij + 1] -= lr * ci + li * cr;
      }
      const br = b[2 * k];
      const bi = b[2 * k + 1];
      b[2 * i] -= lr * br - li * bi;
      b[2 * i + 1] -= lr * bi + li * br;
    }
  }
  // Back substitution.
  for (let i = n - 1; i >= 0; i--) {
    let sr = b[2 * i];
    let si = b[2 * i + 1];
    for (let j = i + 1; j < n; j++) {
      const ij = 2 * (i * n + j);
      const cr = a[ij];
      const ci = a[ij + 1];
      const xr = b[2 * j];
      const xi = b[2 * j + 1];
      sr -= cr * xr - ci * xi;
      si -= cr * xi + ci * xr;
    }
    const ii2 = 2 * (i * n + i);
    const pr = a[ii2];
    const pi = a[ii2 + 1];
    const d = pr * pr + pi * pi;
    b[2 * i] = (sr * pr + si * pi) / d;
    b[2 * i + 1] = (si * pr - sr * pi) / d;
  }
  return true;
}
