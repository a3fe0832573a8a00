import { EXTRAS_TASKS } from '../../runs/insertRunChunks.js';
import type { RunJob } from '../runJob.js';

/**
 * A trivial deterministic run body for queue and crash tests: chunk k hashes (seed, sample index)
 * for each of its samples, so its result depends only on (seed, k) and every sample costs real
 * CPU time. `document.spinPerSample` makes chunks slower; `document.failChunk` makes one chunk throw.
 */
export type FakeChunk = { chunkIndex: number; count: number; sum: number; min: number; max: number };
export type FakeResults = { chunks: number; count: number; sum: number; min: number; max: number };

function hash32(x: number): number {
  x = Math.imul(x ^ (x >>> 16), 0x7feb352d);
  x = Math.imul(x ^ (x >>> 15), 0x846ca68b);
  return (x ^ (x >>> 16)) >>> 0;
}

export const fakeJob: RunJob<{ spin: number; failChunk: number }, FakeChunk, FakeResults> = {
  prepare(document) {
    const d = document as { spinPerSample?: number; failChunk?: number } | null;
    return { spin: d?.spinPerSample ?? 1, failChunk: d?.failChunk ?? -2 };
  },
  runChunk(design, plan, chunkIndex) {
    if (chunkIndex === design.failChunk) throw new RangeError(`chunk ${chunkIndex} cannot be computed`);
    let seedHash = 0;
    for (const ch of plan.seed) seedHash = hash32(seedHash ^ ch.charCodeAt(0));
    const start = chunkIndex * plan.chunkSize;
    const end = Math.min(plan.samples, start + plan.chunkSize);
    let sum = 0;
    let min = Infinity;
    let max = -Infinity;
    for (let s = start; s < end; s++) {
      let h = seedHash ^ s;
      for (let i = 0; i < design.spin; i++) h = hash32(h + i);
      const u = h / 4294967296;
      sum += u;
      if (u < min) min = u;
      if (u > max) max = u;
    }
    return { chunkIndex, count: end - start, sum, min, max };
  },
  // As many parts as the engine's, so runs queued by launchRun or buildRun fit either job.
  extrasParts: EXTRAS_TASKS,
  runExtrasPart(design, plan, part) {
    return { part, spin: design.spin, samples: plan.samples };
  },
  assembleExtras(_design, plan, parts) {
    const ps = parts as { part: number; spin: number; samples: number }[];
    if (ps.length !== EXTRAS_TASKS || ps.some((p, i) => p.part !== i))
      throw new Error('extras parts missing');
    return { spin: ps[0]!.spin, samples: plan.samples };
  },
  runExtras(design, plan) {
    return { spin: design.spin, samples: plan.samples };
  },
  createMerger(_design, plan, extras) {
    if ((extras as { samples?: number }).samples !== plan.samples) throw new Error('extras missing');
    const r: FakeResults = { chunks: 0, count: 0, sum: 0, min: Infinity, max: -Infinity };
    return {
      add(c) {
        if (c.chunkIndex !== r.chunks) throw new Error(`chunk ${c.chunkIndex} out of order`);
        r.chunks++;
        r.sum += c.sum;
        r.count += c.count;
        r.min = Math.min(r.min, c.min);
        r.max = Math.max(r.max, c.max);
      },
      finish: () => r,
    };
  },
  summarize(results) {
    return { validCount: results.count, jointYield: null };
  },
};
