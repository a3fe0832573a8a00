import { EXTRAS_INDEX, type JobPlan, type RunJob } from './runJob.js';

export type ChunkTask = { kind: 'chunk'; runId: string; design: unknown; plan: JobPlan; chunkIndex: number };
/**
 * `chunks` are the stored JSON texts in chunk order, `extras` the once-per-run task's (parsed here,
 * off the worker's main thread).
 */
export type MergeTask = {
  kind: 'merge';
  runId: string;
  design: unknown;
  plan: JobPlan;
  chunks: string[];
  extras: string;
};
export type MergeOutput = { json: string; validCount: number | null; jointYield: number | null };

/**
 * The function a pool thread runs. Results travel back as JSON text so that the worker's main
 * thread (which keeps leases alive) never parses or serialises large objects.
 */
export function createTaskHandler<D, C, R>(job: RunJob<D, C, R>) {
  // A thread serves many chunks of the same run: parse the design once per run.
  const prepared = new Map<string, D>();
  const designOf = (runId: string, document: unknown): D => {
    let d = prepared.get(runId);
    if (d === undefined) {
      if (prepared.size > 16) prepared.clear();
      d = job.prepare(document);
      prepared.set(runId, d);
    }
    return d;
  };
  function handle(task: ChunkTask): string;
  function handle(task: MergeTask): MergeOutput;
  function handle(task: ChunkTask | MergeTask): string | MergeOutput {
    const design = designOf(task.runId, task.design);
    if (task.kind === 'chunk') {
      const out =
        task.chunkIndex === EXTRAS_INDEX
          ? job.runExtras(design, task.plan)
          : job.runChunk(design, task.plan, task.chunkIndex);
      return JSON.stringify(out);
    }
    const results = job.merge(
      design,
      task.plan,
      task.chunks.map((c) => JSON.parse(c) as C),
      JSON.parse(task.extras),
    );
    return { json: JSON.stringify(results), ...job.summarize(results) };
  }
  return handle;
}
