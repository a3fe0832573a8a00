import type { SamplingPlanId } from '../limits.js';
import { createChunkSampler } from './createChunkSampler.js';

/**
 * In place: fills out[j][s] (j < out.length draw dimensions, s < n samples) with the uniforms in
 * (0, 1) of the n samples of chunk `chunkIndex` starting at absolute sample `start` (the whole
 * chunk). See createChunkSampler for the plans.
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
  createChunkSampler(plan, seed, chunkIndex, start, n, out.length).fill(out, n);
}
