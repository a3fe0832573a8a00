import type { SamplingPlanId } from '../limits.js';
import { createStream } from '../random/createStream.js';
import { sobolDirections } from './sobolDirections.js';

const TWO_M32 = 2.3283064365386963e-10;

/** Draws the uniforms of one chunk in consecutive blocks. */
export interface ChunkSampler {
  /** In place: out[j][0..n) = the next n samples' uniforms in (0, 1), draw dimension j. */
  fill(out: readonly Float64Array[], n: number): void;
}

/**
 * Sampler for the `chunkN` samples of chunk `chunkIndex` (first absolute sample `start`) over
 * `dims` draw dimensions. Filling the chunk in blocks of any sizes gives exactly the values of
 * one whole fill, so the run can work block by block in cache. Depends only on (seed, plan,
 * chunkIndex, start, chunkN), never on other chunks:
 * - random: one sfc32 stream per (seed, chunk, dimension).
 * - lhs: Latin hypercube stratified within each chunk (chunkN strata per dimension, shuffled by
 *   the chunk's stream, jittered inside the stratum). A global hypercube would need a permutation
 *   of the whole run; per-chunk strata keep chunks independent and still stratify every chunk.
 * - sobol: one global Sobol sequence indexed by the absolute sample number (so any chunking gives
 *   the same points), with a random digital shift per dimension drawn once from the seed — the
 *   shift keeps the net's structure, makes the estimate unbiased and moves points off 0.
 *
 * @example createChunkSampler('sobol', 'seed-1', 2, 131072, 65536, 11).fill(columns, 4096)
 */
export function createChunkSampler(
  plan: SamplingPlanId,
  seed: string,
  chunkIndex: number,
  start: number,
  chunkN: number,
  dims: number,
): ChunkSampler {
  if (plan === 'random') {
    const streams = Array.from({ length: dims }, (_v, j) => createStream(seed, 'draw', chunkIndex, j));
    return { fill: (out, n) => streams.forEach((g, j) => g.fillOpen(out[j], n)) };
  }
  if (plan === 'lhs') return latinHypercubeSampler(seed, chunkIndex, chunkN, dims);
  return sobolSampler(seed, start, dims);
}

function latinHypercubeSampler(seed: string, chunkIndex: number, chunkN: number, dims: number): ChunkSampler {
  const streams = Array.from({ length: dims }, (_v, j) => createStream(seed, 'lhs', chunkIndex, j));
  const perms = streams.map((g) => {
    const perm = new Int32Array(chunkN);
    for (let s = 0; s < chunkN; s++) perm[s] = s;
    for (let s = chunkN - 1; s > 0; s--) {
      const r = g.nextBelow(s + 1);
      const tmp = perm[s];
      perm[s] = perm[r];
      perm[r] = tmp;
    }
    return perm;
  });
  let pos = 0;
  return {
    fill(out, n) {
      for (let j = 0; j < dims; j++) {
        const col = out[j];
        const perm = perms[j];
        const g = streams[j];
        for (let s = 0; s < n; s++) col[s] = (perm[pos + s] + g.nextOpen()) / chunkN;
      }
      pos += n;
    },
  };
}

function sobolSampler(seed: string, start: number, dims: number): ChunkSampler {
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
  let i = start;
  return {
    fill(out, n) {
      for (let s = 0; s < n; s++, i++) {
        for (let j = 0; j < dims; j++) out[j][s] = (x[j] + 0.5) * TWO_M32;
        // The next point differs from this one in the direction number of the lowest zero bit of i.
        let c = 0;
        while ((i >>> c) & 1) c++;
        for (let j = 0; j < dims; j++) x[j] = (x[j] ^ v[j][c]) >>> 0;
      }
    },
  };
}
