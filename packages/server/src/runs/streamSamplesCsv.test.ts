import { Writable } from 'node:stream';
import { parseDesign, type RunPlan } from '@sigmatail/engine';
import { afterAll, describe, expect, it } from 'vitest';
import { createExportPool } from './exportPool.js';
import { streamSamplesCsv } from './streamSamplesCsv.js';
import { exampleDesign } from './testing/exampleDesign.js';

const parsed = parseDesign(exampleDesign());
if (!parsed.ok) throw new Error('example design does not parse');
const design = parsed.design;
const plan: RunPlan = { samples: 20_000, seed: 'csv', plan: 'random', chunkSize: 5_000 };
const pool = createExportPool();
afterAll(() => pool.close());

/** A slow consumer: takes each write on the next turn of the event loop, with a small buffer. */
function slowSink(onWrite?: (bytes: number, sink: Writable) => void) {
  let bytes = 0;
  let maxBuffered = 0;
  const text: string[] = [];
  const sink = new Writable({
    highWaterMark: 64 * 1024,
    write(chunk: Buffer, _enc, done) {
      bytes += chunk.length;
      text.push(chunk.toString());
      onWrite?.(bytes, sink);
      setImmediate(done);
    },
  });
  const origWrite = sink.write.bind(sink) as (c: string) => boolean;
  sink.write = ((c: string) => {
    const ok = origWrite(c);
    maxBuffered = Math.max(maxBuffered, sink.writableLength);
    return ok;
  }) as typeof sink.write;
  return { sink, stats: () => ({ bytes, maxBuffered, text: text.join('') }) };
}

describe('streamSamplesCsv', () => {
  it('streams every sample with backpressure: the buffer stays near one batch whatever N is', async () => {
    const { sink, stats } = slowSink();
    await streamSamplesCsv(sink, design, plan, pool.slice);
    const { bytes, maxBuffered, text } = stats();
    const lines = text.trimEnd().split('\n');
    expect(lines).toHaveLength(20_001);
    expect(lines[0]!.startsWith('sample,')).toBe(true);
    expect(lines.slice(1).map((l) => Number(l.split(',')[0]))).toEqual(
      Array.from({ length: 20_000 }, (_, i) => i),
    );
    expect(bytes).toBeGreaterThan(3_000_000);
    expect(maxBuffered).toBeLessThan(3_000_000); // a 2 000-row slice is ~0.8 MB; 20 000 rows are ~7 MB
  });

  it('stops generating when the client goes away', async () => {
    const { sink, stats } = slowSink((bytes, s) => {
      if (bytes > 200_000) s.destroy();
    });
    await streamSamplesCsv(sink, design, { ...plan, samples: 1_000_000 }, pool.slice);
    // At most the slice being written when the client left and the one computed meanwhile
    // (2 000 rows each), not the million rows of the run.
    const rows = stats().text.split('\n').length - 1;
    expect(rows).toBeLessThan(6_000);
  });
});
