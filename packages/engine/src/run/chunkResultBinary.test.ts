import { describe, expect, it } from 'vitest';
import { buildTestDesign } from './buildTestDesign.js';
import type { ChunkResult } from './chunkResult.js';
import { decodeChunkResult, encodeChunkResult } from './chunkResultBinary.js';
import { designSetup } from './designSetup.js';
import { mergeChunks, runChunk } from './runApi.js';
import type { RunPlan } from './runPlan.js';

const viaJson = (c: ChunkResult): ChunkResult => JSON.parse(JSON.stringify(c)) as ChunkResult;

describe('chunk results as bytes', () => {
  const design = buildTestDesign();
  const ids = designSetup(design).model.kernel.metrics;
  const plan: RunPlan = { samples: 5_000, seed: 'bytes', plan: 'random', chunkSize: 2_000 };
  const chunks = [0, 1, 2].map((k) => runChunk(design, plan, k));

  it('decode(encode(chunk)) equals the chunk after a JSON round trip', () => {
    for (const c of chunks) {
      const bytes = encodeChunkResult(c);
      expect(decodeChunkResult(bytes, ids)).toStrictEqual(viaJson(c));
    }
  });

  it('a run merged from decoded chunks is bit for bit the run merged from JSON chunks', () => {
    const decoded = chunks.map((c) => decodeChunkResult(encodeChunkResult(c), ids));
    const extras = { nominal: {} };
    expect(JSON.stringify(mergeChunks(design, plan, decoded, extras))).toBe(
      JSON.stringify(mergeChunks(design, plan, chunks.map(viaJson), extras)),
    );
  });

  it('keeps nulls, turns −0 into 0 as JSON does, and reads bytes at any offset', () => {
    const c = structuredClone(chunks[0]);
    const first = c.metrics[ids[0]];
    Object.assign(first, { count: 0, mean: null, min: null, max: null, m2: -0, bins: [], binOffset: 0 });
    const bytes = encodeChunkResult(c);
    const shifted = new Uint8Array(bytes.byteLength + 3).subarray(3);
    shifted.set(bytes);
    const back = decodeChunkResult(shifted, ids);
    expect(back).toStrictEqual(viaJson(c));
    expect(Object.is(back.metrics[ids[0]].m2, 0)).toBe(true);
  });

  it('stores each count in as few 7-bit bytes as it needs, up to 2^32 − 1', () => {
    const c = structuredClone(chunks[0]);
    const sizes = [0, 127, 128, 16_383, 16_384, 2 ** 21, 2 ** 28, 2 ** 32 - 1];
    for (const id of ids) c.metrics[id].bins = [];
    c.metrics[ids[1]].bins = sizes;
    const bare = encodeChunkResult({
      ...c,
      metrics: { ...c.metrics, [ids[1]]: { ...c.metrics[ids[1]], bins: [] } },
    });
    const bytes = encodeChunkResult(c);
    expect(bytes.byteLength - bare.byteLength).toBe(1 + 1 + 2 + 2 + 3 + 4 + 5 + 5);
    expect(decodeChunkResult(bytes, ids).metrics[ids[1]].bins).toEqual(sizes);
  });

  it('a default 65 536-sample chunk takes less room than its JSON', () => {
    const big = runChunk(design, { ...plan, samples: 65_536, chunkSize: 65_536 }, 0);
    const bytes = encodeChunkResult(big);
    expect(bytes.byteLength).toBeLessThan(JSON.stringify(big).length);
    expect(decodeChunkResult(bytes, ids)).toStrictEqual(viaJson(big));
  });

  it('refuses counts that are not uint32, bytes of another layout and another design', () => {
    const c = structuredClone(chunks[0]);
    c.metrics[ids[0]].bins[0] = 1.5;
    expect(() => encodeChunkResult(c)).toThrow(RangeError);
    const bytes = encodeChunkResult(chunks[0]);
    expect(() => decodeChunkResult(bytes, ids.slice(1))).toThrow(/metrics/);
    const other = bytes.slice();
    new Float64Array(other.buffer, 0, 1)[0] = 99;
    expect(() => decodeChunkResult(other, ids)).toThrow(/layout/);
    expect(() => decodeChunkResult(new Uint8Array(8), ids)).toThrow(/too short/);
    expect(() => decodeChunkResult(bytes.slice(0, bytes.byteLength - 1), ids)).toThrow(/truncated/);
  });
});
