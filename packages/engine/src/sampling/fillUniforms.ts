import type { SamplingPlanId } from '../limits.js';
import { createStream } from '../random/createStream.js';
import { sobolDirections } from './sobolDirections.js';

const TWO_M32 = 2.3283064365386963e-10;

/**
 * In place: fills out[j][s] (j < out.length draw dimensions, s < n samples) with uniforms in the
 * open interval (0, 1) for the samples start..start+n-1 of chunk `chunkIndex`. Depends only on
 * (seed, plan, chunkIndex, start, n), never on other chunks, so chunks can be computed anywhere.
 * - random: one sfc32 stream per (seed, chunk, dimension).
 * - lhs: Latin hypercube stratified within each chunk (n strata per dimension, shuffled by the
 *   chunk's stream, jittered inside the stratum). A global hypercube would need a permutation of
 *   the whole run; per-chunk strata keep chunks independent and still stratify every 65 536 draws.
 * - sobol: one global Sobol sequence indexed by the absolute sample number (so any chunking gives
 *   the same points), with a random digital shift per dimension drawn once from (seed) — the
 *   shift keeps the net's structure, makes the estimate unbiased and moves points off 0.
 *
 * @example fillUniforms('sobol', 'seed-1', 0, 0, 1024, columns)
 */
export function fillUniforms(
  plan: SamplingPlanId,
  seed: string,
  chunkIndex: number,
  start: number,
  n: number,
  out: readonly Float64Array[],
): void {
  if (plan === 'random') {
    for (let j = 0; j < out.length; j++) createStream(seed, 'draw', chunkIndex, j).fillOpen(out[j], n);
  } else if (plan === 'lhs') {
    fillLatinHypercube(seed, chunkIndex, n, out);
  } else {
    fillSobol(seed, start, n, out);
  }
}

function fillLatinHypercube(seed: string, chunkIndex: number, n: number, out: readonly Float64Array[]): void {
  const perm = new Int32Array(n);
  for (let j = 0; j < out.length; j++) {
    const g = createStream(seed, 'lhs', chunkIndex, j);
    for (let s = 0; s < n; s++) perm[s] = s;
    for (let s = n - 1; s > 0; s--) {
      const r = g.nextBelow(s + 1);
      const tmp = perm[s];
      perm[s] = perm[r];
      perm[r] = tmp;
    }
    const col = out[j];
    for (let s = 0; s < n; s++) col[s] = (perm[s] + g.nextOpen()) / n;
  }
}

function fillSobol(seed: string, start: number, n: number, out: readonly Float64Array[]): void {
  const dims = out.length;
  const v = sobolDirections(dims);
  const shiftStream = createStream(seed, 'sobol-shift');
  const x = new Uint32Array(dims);
  // Sample numbers stay below 2^31 (MAX_SAMPLES), so 32-bit integer ops are exact.
  // Point number i uses the Gray code i ^ (i >> 1); jump straight to `start`, then step.
  const gray = (start ^ (start >>> 1)) >>> 0;
  for (let j = 0; j < dims; j++) {
    let acc = shiftStream.nextUint32();
    for (let b = 0; b < 31; b++) if ((gray >>> b) & 1) acc ^= v[j][b];
    x[j] = acc >>> 0;
  }
  for (let s = 0; s < n; s++) {
    for (let j = 0; j < dims; j++) out[j][s] = (x[j] + 0.5) * TWO_M32;
    // Next index differs from this one's Gray code in the bit of the lowest zero of (start+s).
    const i = start + s;
    let c = 0;
    while ((i >>> c) & 1) c++;
    for (let j = 0; j < dims; j++) x[j] = (x[j] ^ v[j][c]) >>> 0;
  }
}
