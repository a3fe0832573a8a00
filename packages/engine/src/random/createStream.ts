import seedrandom from 'seedrandom';
import { Sfc32 } from './sfc32.js';

/**
 * A named random stream: the generator for one purpose within one run, derived only from the run
 * seed and the labels (e.g. `createStream(seed, 'draw', chunkIndex, dim)`). seedrandom's alea
 * hashes the joined key into four 32-bit words that seed an sfc32; alea is used only for this
 * hashing, never in the hot loop. Two streams with different labels are independent for our
 * purposes; the same labels always give the same stream.
 *
 * @example
 * const g = createStream('run-42', 'draw', 0, 3); // chunk 0, draw dimension 3
 */
export function createStream(seed: string, ...labels: (string | number)[]): Sfc32 {
  const key = JSON.stringify([seed, ...labels]);
  const hash = seedrandom.alea(key);
  return new Sfc32(hash.int32(), hash.int32(), hash.int32(), hash.int32());
}
