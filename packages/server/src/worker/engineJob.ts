import {
  assembleExtras,
  createRunAccumulator,
  decodeChunkResult,
  designSetup,
  encodeChunkResult,
  EXTRAS_PARTS,
  parseDesign,
  runChunk,
  runExtras,
  runExtrasPart,
  type ChunkResult,
  type ExtrasPartValue,
  type ResolvedDesign,
  type RunResults,
  withMonteCarloSpread,
} from '@sigmatail/engine';
import type { RunJob } from './runJob.js';

/** The real run body: the engine's chunked Monte Carlo on the stored design snapshot. */
export const engineJob: RunJob<ResolvedDesign, ChunkResult, RunResults> = {
  prepare(document) {
    const parsed = parseDesign(document);
    if (!parsed.ok) {
      const first = parsed.errors[0];
      throw new Error(
        `stored design is invalid: ${first ? `${first.path}: ${first.message}` : 'unknown error'}`,
      );
    }
    return parsed.design;
  },
  runChunk: (design, plan, chunkIndex) => runChunk(design, plan, chunkIndex),
  encodeChunk: (_design, chunk) => encodeChunkResult(chunk),
  decodeChunk: (design, bytes) => decodeChunkResult(bytes, designSetup(design).model.kernel.metrics),
  extrasParts: EXTRAS_PARTS.length,
  runExtrasPart: (design, plan, part) => runExtrasPart(designSetup(design), plan, part),
  assembleExtras: (design, _plan, parts) => assembleExtras(designSetup(design), parts as ExtrasPartValue[]),
  runExtras: (design, plan) => runExtras(design, plan),
  // The steps of the engine's mergeChunks, fed one chunk at a time instead of from one array.
  createMerger(design, plan, extras) {
    const acc = createRunAccumulator(designSetup(design), plan);
    return {
      add: (chunk) => acc.add(chunk),
      finish: () => withMonteCarloSpread(acc.finish(extras as Partial<RunResults>)),
    };
  },
  summarize: (results) => ({ validCount: results.validCount, jointYield: results.joint.yield }),
};
