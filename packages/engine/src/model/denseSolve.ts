/**
 * Solves A·x = b in place by Gaussian elimination with partial pivoting. `a` is n×n row-major and
 * is destroyed; `b` is overwritten with x. Real arrays; a complex version can pair real and
 * imaginary arrays the same way. Returns false when A is singular.
 *
 * @example
 * const a = Float64Array.of(2, 1, 1, 3), b = Float64Array.of(3, 5);
 * solveDenseInPlace(a, b, 2); // b = [0.8, 1.4]
 */
export function solveDenseInPlace(a: Float64Array, b: Float64Array, n: number): boolean {
  for (let col = 0; col < n; col++) {
    let piv = col;
    let best = Math.abs(a[col * n + col]);
    for (let r = col + 1; r < n; r++) {
      const v = Math.abs(a[r * n + col]);
      if (v > best) {
        best = v;
        piv = r;
      }
    }
    if (best === 0) return false;
    if (piv !== col) {
      for (let k = 0; k < n; k++) {
        const t = a[col * n + k];
        a[col * n + k] = a[piv * n + k];
        a[piv * n + k] = t;
      }
      const t = b[col];
      b[col] = b[piv];
      b[piv] = t;
    }
    const d = a[col * n + col];
    for (let r = col + 1; r < n; r++) {
      const f = a[r * n + col] / d;
      if (f === 0) continue;
      for (let k = col; k < n; k++) a[r * n + k] -= f * a[col * n + k];
      b[r] -= f * b[col];
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r];
    for (let k = r + 1; k < n; k++) s -= a[r * n + k] * b[k];
    b[r] = s / a[r * n + r];
  }
  return true;
}
