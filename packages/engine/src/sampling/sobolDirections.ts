// Initial direction numbers for Sobol dimensions 2..21, from S. Joe and F. Y. Kuo, "Constructing
// Sobol sequences with better two-dimensional projections", SIAM J. Sci. Comput. 30 (2008)
// 2635–2654, file new-joe-kuo-6.21201 (columns d, s, a, m_i). Dimension 1 is the van der Corput
// sequence. 21 dimensions cover every draw dimension a design can have (13 at most).
const TABLE: readonly (readonly [number, number, readonly number[]])[] = [
  [1, 0, [1]],
  [2, 1, [1, 3]],
  [3, 1, [1, 3, 1]],
  [3, 2, [1, 1, 1]],
  [4, 1, [1, 1, 3, 3]],
  [4, 4, [1, 3, 5, 13]],
  [5, 2, [1, 1, 5, 5, 17]],
  [5, 4, [1, 1, 5, 5, 5]],
  [5, 7, [1, 1, 7, 11, 19]],
  [5, 11, [1, 1, 5, 1, 1]],
  [5, 13, [1, 1, 1, 3, 11]],
  [5, 14, [1, 3, 5, 5, 31]],
  [6, 1, [1, 3, 3, 9, 7, 49]],
  [6, 13, [1, 1, 1, 15, 21, 21]],
  [6, 16, [1, 3, 1, 13, 27, 49]],
  [6, 19, [1, 1, 1, 15, 7, 5]],
  [6, 22, [1, 3, 1, 15, 13, 25]],
  [6, 25, [1, 1, 5, 5, 19, 61]],
  [7, 1, [1, 3, 7, 11, 23, 15, 103]],
  [7, 4, [1, 3, 7, 13, 13, 15, 69]],
];

/** Most Sobol dimensions available. */
export const SOBOL_MAX_DIMS = TABLE.length + 1;

/**
 * 32 left-aligned direction numbers per dimension (v[j] = m_j · 2^(32-j), as unsigned 32-bit),
 * built by the standard recurrence from the Joe–Kuo primitive polynomials.
 *
 * @example sobolDirections(2)[1][0] // 2^31
 */
export function sobolDirections(dims: number): Uint32Array[] {
  if (dims > SOBOL_MAX_DIMS) throw new RangeError(`Sobol plan supports at most ${SOBOL_MAX_DIMS} dimensions`);
  const out: Uint32Array[] = [];
  for (let d = 0; d < dims; d++) {
    const v = new Uint32Array(32);
    if (d === 0) {
      for (let j = 0; j < 32; j++) v[j] = 2 ** (31 - j);
    } else {
      const [s, a, m] = TABLE[d - 1];
      for (let j = 0; j < s; j++) v[j] = m[j] * 2 ** (31 - j);
      for (let j = s; j < 32; j++) {
        let x = v[j - s] ^ (v[j - s] >>> s);
        for (let k = 1; k < s; k++) {
          if ((a >>> (s - 1 - k)) & 1) x ^= v[j - k];
        }
        v[j] = x >>> 0;
      }
    }
    out.push(v);
  }
  return out;
}
