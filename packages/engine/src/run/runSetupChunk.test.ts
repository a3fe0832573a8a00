import { describe, expect, it } from 'vitest';
import { preparePartSpread } from '../spread/partSpread.js';
import { buildTestDesign } from './buildTestDesign.js';
import { createSampleModel } from './createSampleModel.js';
import { mergeSetupChunks } from './mergeSetupChunks.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import { createRunSetup } from './runSetup.js';
import { runSetupChunk } from './runSetupChunk.js';
import { mergeChunks, runChunk, runDesignIssues, sampleRows } from './runApi.js';
import { setupSampleRows } from './setupSampleRows.js';
import { additiveKernel } from './testKernels.js';
import { createStream } from '../random/createStream.js';

const model = createSampleModel(additiveKernel([0.01, 0.01, 0.01]), {
  x1: preparePartSpread({ value: 1, tolerance: 3, spread: { kind: 'normal' } }),
  x2: preparePartSpread({ value: 1, tolerance: 3, spread: { kind: 'uniform' } }),
  x3: preparePartSpread({ value: 1, tolerance: 3, spread: { kind: 'binned', inner: 1 } }),
});
const setup = createRunSetup(model, [{ metric: 'y', min: -2.5, max: 2.5 }]);
const noExtras = { influence: false, varianceIndices: false, worstCase: false };

function shuffled<T>(xs: T[], seed: string): T[] {
  const g = createStream(seed);
  const out = [...xs];
  for (let i = out.length - 1; i > 0; i--) {
    const r = g.nextBelow(i + 1);
    [out[i], out[r]] = [out[r], out[i]];
  }
  return out;
}

describe('chunked runs are bit-identical for any worker count and arrival order', () => {
  for (const kind of ['random', 'lhs', 'sobol'] as const) {
    it(`${kind}: one worker in order vs shuffled arrival vs two interleaved workers`, () => {
      const plan: RunPlan = { samples: 10_000, seed: 'inv', plan: kind, chunkSize: 1024, analyses: noExtras };
      const k = chunkCount(plan);
      const inOrder = Array.from({ length: k }, (_v, i) => runSetupChunk(setup, plan, i));
      // Two "workers": one takes even chunks, the other odd ones, results arrive worker by worker.
      const even = inOrder.map((_c, i) => i).filter((i) => i % 2 === 0);
      const odd = inOrder.map((_c, i) => i).filter((i) => i % 2 === 1);
      const twoWorkers = [...odd, ...even].map((i) => runSetupChunk(setup, plan, i));
      const a = JSON.stringify(mergeSetupChunks(setup, plan, inOrder));
      expect(JSON.stringify(mergeSetupChunks(setup, plan, shuffled(inOrder, 'order')))).toBe(a);
      expect(JSON.stringify(mergeSetupChunks(setup, plan, twoWorkers))).toBe(a);
      // Chunk results survive a JSON round trip (they are stored as jsonb).
      expect(JSON.stringify(mergeSetupChunks(setup, plan, JSON.parse(JSON.stringify(inOrder))))).toBe(a);
    });
  }

  it('a chunk gives the same result whatever ran before it in the same worker (pooled buffers)', () => {
    const plan: RunPlan = { samples: 9000, seed: 'pool', plan: 'lhs', chunkSize: 3000 };
    const first = JSON.stringify(runSetupChunk(setup, plan, 1));
    runSetupChunk(setup, { ...plan, plan: 'random', seed: 'other' }, 2);
    runSetupChunk(setup, plan, 0);
    expect(JSON.stringify(runSetupChunk(setup, plan, 1))).toBe(first);
  });

  it('sobol indexes one global sequence: the samples do not depend on the chunk size', () => {
    const rows = (chunkSize: number) => {
      const plan: RunPlan = { samples: 3000, seed: 'glob', plan: 'sobol', chunkSize };
      return Array.from({ length: chunkCount(plan) }, (_v, i) => [
        ...setupSampleRows(setup, plan, i).rows,
      ]).flat();
    };
    expect(rows(1000)).toEqual(rows(256));
  });

  it('rejects missing chunks and bad plans with a message naming the field', () => {
    const plan: RunPlan = { samples: 3000, seed: 's', plan: 'random', chunkSize: 1000, analyses: noExtras };
    expect(() => mergeSetupChunks(setup, plan, [runSetupChunk(setup, plan, 0)])).toThrow(/3 chunks/);
    expect(() => runSetupChunk(setup, plan, 3)).toThrow(/chunkIndex/);
    expect(() => chunkCount({ ...plan, samples: 0 })).toThrow('samples must be an integer 1..100000000');
  });

  it('stage design: chunks merge identically in any order and export rows regenerate the chunk', () => {
    const design = buildTestDesign();
    const plan: RunPlan = { samples: 3000, seed: 'design', plan: 'lhs', chunkSize: 1000, analyses: noExtras };
    const chunks = [2, 0, 1].map((i) => runChunk(design, plan, i));
    const a = JSON.stringify(mergeChunks(design, plan, chunks));
    expect(JSON.stringify(mergeChunks(design, plan, [...chunks].reverse()))).toBe(a);
    const { columns, rows } = sampleRows(design, plan, 1);
    const all = [...rows];
    expect(all).toHaveLength(1000);
    expect(columns[0]).toBe('sample');
    expect(all[0][0]).toBe(1000);
    const m = columns.indexOf('balanceDb');
    const mean = all.reduce((s, r) => s + r[m], 0) / all.length;
    expect(chunks.find((c) => c.chunkIndex === 1)?.metrics.balanceDb.mean).toBeCloseTo(mean, 10);
  });
});

describe('runDesignIssues', () => {
  it('names the field of a spread the engine cannot run', () => {
    expect(runDesignIssues(buildTestDesign())).toEqual([]);
    const bad = buildTestDesign();
    bad.parts.rt = { value: 10e3, tolerance: 5, spread: { kind: 'binned', inner: 8 } };
    expect(runDesignIssues(bad)).toEqual([
      {
        path: 'parts.rt.spread.inner',
        message: 'parts.rt.spread.inner must be 0 <= inner < tolerance (got 8)',
      },
    ]);
  });
});
