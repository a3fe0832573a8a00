import { chunkCount, mergeChunks, parseDesign, runChunk, runExtras } from '@sigmatail/engine';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ChunkQueue } from '../runs/chunkQueue.js';
import { EXTRAS_TASKS } from '../runs/insertRunChunks.js';
import type { Db } from '../runs/runsDb.js';
import { buildRun } from '../runs/testing/buildRun.js';
import { exampleDesign } from '../runs/testing/exampleDesign.js';
import { createTestDb } from '../runs/testing/runsTestDb.js';
import { engineJob } from './engineJob.js';
import { EXTRAS_INDEX, extrasPartIndex, type JobPlan } from './runJob.js';
import { createTaskHandler, type MergeOutput } from './taskHandler.js';

let db: Db;
let url: string;
let drop: (() => Promise<void>) | undefined;
beforeAll(async () => {
  ({ db, url, drop } = await createTestDb('sigmatail_test_taskhandler'));
});
afterAll(async () => {
  await drop?.();
});

const document = exampleDesign();
const plan: JobPlan = { samples: 3_000, seed: 'tasks', plan: 'random', chunkSize: 1_000, analyses: {} };

/** The run computed by the engine directly, without queue, threads or database, as text. */
function direct(): string {
  const parsed = parseDesign(document);
  if (!parsed.ok) throw new Error('example design does not parse');
  const chunks = Array.from({ length: chunkCount(plan) }, (_c, k) => runChunk(parsed.design, plan, k));
  return JSON.stringify(mergeChunks(parsed.design, plan, chunks, runExtras(parsed.design, plan)));
}

describe('the engine task handler', () => {
  const handle = createTaskHandler(engineJob, { transfer: false });
  const task = (runId: string, chunkIndex: number) =>
    ({ kind: 'chunk', runId, design: document, plan, chunkIndex }) as const;
  const merge = (runId: string) =>
    handle({ kind: 'merge', runId, design: document, plan, databaseUrl: url }) as Promise<MergeOutput>;

  it('computes each once-per-run part as JSON and chunks as bytes; the merge equals the engine run', async () => {
    const runId = await buildRun(db, {
      samples: plan.samples,
      chunkSize: plan.chunkSize,
      seed: plan.seed,
      design: document,
    });
    const rows = await db
      .selectFrom('run_chunks')
      .select('chunk_index')
      .where('run_id', '=', runId)
      .execute();
    const parts = Array.from({ length: EXTRAS_TASKS }, (_p, i) => extrasPartIndex(i));
    expect(rows.map((r) => r.chunk_index).sort((a, b) => a - b)).toEqual([...parts.reverse(), 0, 1, 2]);
    const q = new ChunkQueue(db, 'handler', 5_000);
    // Parts delivered in reverse order, chunk 0 as JSON text as a worker before the bytes stored it.
    for (const k of parts) {
      const out = handle(task(runId, k));
      expect(typeof out).toBe('string');
      await q.deliver(runId, k, out);
    }
    const parsed = parseDesign(document);
    if (!parsed.ok) throw new Error('no design');
    await q.deliver(runId, 0, JSON.stringify(runChunk(parsed.design, plan, 0)));
    for (const k of [2, 1]) {
      const out = handle(task(runId, k));
      expect(out).toBeInstanceOf(Uint8Array);
      const d = await q.deliver(runId, k, out);
      expect(d).toMatchObject({ kind: 'stored', chunkTotal: 3 + EXTRAS_TASKS });
    }
    const stored = await db
      .selectFrom('run_chunks')
      .select(['chunk_index', 'result_bin'])
      .where('run_id', '=', runId)
      .where('chunk_index', '>=', 0)
      .orderBy('chunk_index')
      .execute();
    expect(stored.map((r) => r.result_bin !== null)).toEqual([false, true, true]);
    const out = await merge(runId);
    // Compared as text, so a difference in the last bit of any number fails.
    expect(out.json === direct(), 'merged results differ from the engine run directly').toBe(true);
  });

  it('still computes and merges a run queued with the once-per-run work as one task', async () => {
    const runId = await buildRun(db, {
      samples: plan.samples,
      chunkSize: plan.chunkSize,
      seed: plan.seed,
      design: document,
      legacyExtras: true,
    });
    const q = new ChunkQueue(db, 'legacy', 5_000);
    const claimed = (await q.claim(20)).filter((c) => c.runId === runId);
    expect(claimed.map((c) => c.chunkIndex)).toEqual([EXTRAS_INDEX, 0, 1, 2]);
    for (const c of claimed) await q.deliver(runId, c.chunkIndex, handle(task(runId, c.chunkIndex)));
    expect((await merge(runId)).json === direct()).toBe(true);
  });

  it('refuses to merge while a once-per-run part is missing', async () => {
    const runId = await buildRun(db, { samples: 1_000, chunkSize: 1_000, seed: plan.seed, design: document });
    await expect(merge(runId)).rejects.toThrow(/once-per-run results are not stored/);
  });
});
