import type { MetricChunk } from '../stats/metricChunk.js';
import type { ChunkResult } from './chunkResult.js';

/** Layout version, the first number of every encoded chunk. */
const BINARY_VERSION = 2;
/** Float64 slots before the spec passes: layout, chunk fields, pairing, spec and metric counts. */
const HEAD = 11;
/** Float64 slots per metric: count, mean, m2, min, max, under, over, binOffset, bin count. */
const PER_METRIC = 9;

/** Bytes of a count as a varint (7 bits a byte, low bits first). */
const varintBytes = (c: number): number =>
  c < 0x80 ? 1 : c < 0x4000 ? 2 : c < 0x200000 ? 3 : c < 0x10000000 ? 4 : 5;

/**
 * A chunk result as bytes, for moving it between threads without a copy and storing it without
 * JSON: float64 fields (header, spec passes, per metric the statistics; NaN for a null), then
 * every metric's bins as varints (7 bits a byte: an empty bin is one byte, a count under 16 384
 * two). Metrics in the chunk's own key order (kernel order); decodeChunkResult needs those ids.
 * A default 65 536-sample chunk of the capacitor demo design: ~half its JSON; nothing to write or
 * parse, and the buffer moves between threads uncopied.
 *
 * @example decodeChunkResult(encodeChunkResult(chunk), setup.model.kernel.metrics)
 */
export function encodeChunkResult(chunk: ChunkResult): Uint8Array {
  const metrics = Object.values(chunk.metrics);
  const floats = HEAD + chunk.specPass.length + PER_METRIC * metrics.length;
  let binBytes = 0;
  for (const m of metrics) {
    for (const c of m.bins) {
      if (!(c >= 0 && c <= 0xffffffff && Number.isInteger(c)))
        throw new RangeError(`bins must be counts 0..2^32-1 (got ${c})`);
      binBytes += varintBytes(c);
    }
  }
  const buffer = new ArrayBuffer(floats * 8 + binBytes);
  const f = new Float64Array(buffer, 0, floats);
  const u = new Uint8Array(buffer, floats * 8, binBytes);
  const p = chunk.pairing;
  f.set([BINARY_VERSION, chunk.chunkIndex, chunk.start, chunk.n, chunk.validCount, chunk.jointPass]);
  f.set([p.samples, p.draws, p.failures, chunk.specPass.length, metrics.length], 6);
  f.set(chunk.specPass, HEAD);
  let at = HEAD + chunk.specPass.length;
  let b = 0;
  for (const m of metrics) {
    f[at++] = m.count;
    f[at++] = m.mean ?? NaN;
    f[at++] = m.m2;
    f[at++] = m.min ?? NaN;
    f[at++] = m.max ?? NaN;
    f[at++] = m.under;
    f[at++] = m.over;
    f[at++] = m.binOffset;
    f[at++] = m.bins.length;
    for (const count of m.bins) {
      let c = count;
      while (c >= 0x80) {
        u[b++] = (c & 0x7f) | 0x80;
        c = Math.floor(c / 0x80);
      }
      u[b++] = c;
    }
  }
  return new Uint8Array(buffer);
}

/** A JSON round trip turns −0 into 0 and NaN into null; decoding does the same, so merges match. */
const num = (x: number): number => (x === 0 ? 0 : x);
const orNull = (x: number): number | null => (Number.isNaN(x) ? null : num(x));

/**
 * The ChunkResult of encodeChunkResult's bytes; `metricIds` name the metrics in kernel order.
 * Equal to JSON.parse(JSON.stringify(chunk)). Throws RangeError for bytes of another layout.
 */
export function decodeChunkResult(input: Uint8Array, metricIds: readonly string[]): ChunkResult {
  // A driver's buffer may start anywhere in a shared pool: float64 views need 8-byte alignment.
  const bytes = input.byteOffset % 8 === 0 ? input : new Uint8Array(input);
  if (bytes.byteLength < HEAD * 8) throw new RangeError('chunk bytes: too short');
  const head = new Float64Array(bytes.buffer, bytes.byteOffset, HEAD);
  if (head[0] !== BINARY_VERSION)
    throw new RangeError(`chunk bytes: layout ${head[0]} is not ${BINARY_VERSION}`);
  const specs = head[9];
  const count = head[10];
  if (count !== metricIds.length)
    throw new RangeError(`chunk bytes: ${count} metrics, the design has ${metricIds.length}`);
  const floats = HEAD + specs + PER_METRIC * count;
  if (bytes.byteLength < floats * 8) throw new RangeError('chunk bytes: truncated');
  const f = new Float64Array(bytes.buffer, bytes.byteOffset, floats);
  const u = new Uint8Array(bytes.buffer, bytes.byteOffset + floats * 8, bytes.byteLength - floats * 8);
  const specPass = Array.from(f.subarray(HEAD, HEAD + specs), num);
  const metrics: Record<string, MetricChunk> = {};
  let at = HEAD + specs;
  let b = 0;
  for (const id of metricIds) {
    const nBins = f[at + 8];
    const bins = new Array<number>(nBins);
    for (let i = 0; i < nBins; i++) {
      let x = 0;
      let scale = 1;
      let byte: number;
      do {
        if (b >= u.length) throw new RangeError('chunk bytes: bins truncated');
        byte = u[b++];
        x += (byte & 0x7f) * scale;
        scale *= 0x80;
      } while (byte & 0x80);
      bins[i] = x;
    }
    metrics[id] = {
      count: num(f[at]),
      mean: orNull(f[at + 1]),
      m2: num(f[at + 2]),
      min: orNull(f[at + 3]),
      max: orNull(f[at + 4]),
      under: num(f[at + 5]),
      over: num(f[at + 6]),
      binOffset: num(f[at + 7]),
      bins,
    };
    at += PER_METRIC;
  }
  if (b !== u.length) throw new RangeError('chunk bytes: bin counts do not add up');
  return {
    chunkIndex: num(head[1]),
    start: num(head[2]),
    n: num(head[3]),
    validCount: num(head[4]),
    metrics,
    specPass,
    jointPass: num(head[5]),
    pairing: { samples: num(head[6]), draws: num(head[7]), failures: num(head[8]) },
  };
}
