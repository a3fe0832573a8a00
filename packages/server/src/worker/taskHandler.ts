import pg from 'pg';
import { EXTRAS_INDEX, type JobPlan, type RunJob } from './runJob.js';

export type ChunkTask = { kind: 'chunk'; runId: string; design: unknown; plan: JobPlan; chunkIndex: number };
/** The merge reads the stored chunk results itself, page by page, so memory stays flat. */
export type MergeTask = { kind: 'merge'; runId: string; design: unknown; plan: JobPlan; databaseUrl: string };
export type MergeOutput = { json: string; validCount: number | null; jointYield: number | null };

/** Chunk results read per query while merging. */
const MERGE_PAGE = 32;

/**
 * The function a pool thread runs. Chunk results travel back as JSON text, and the merge reads
 * chunk results from the database in this thread, so the worker's main thread (which keeps
 * leases alive) never parses or holds large objects.
 */
export function createTaskHandler<D, C, R>(job: RunJob<D, C, R>) {
  // A thread serves many chunks of one run, and many runs of one design: prepare each design
  // document once (keyed by its text), so the engine's per-design setup is reused across runs.
  const prepared = new Map<string, D>();
  const designOf = (_runId: string, document: unknown): D => {
    const key = JSON.stringify(document);
    let d = prepared.get(key);
    if (d === undefined) {
      if (prepared.size >= 16) prepared.clear();
      d = job.prepare(document);
      prepared.set(key, d);
    }
    return d;
  };
  let client: Promise<pg.Client> | undefined;
  const connect = (url: string) => {
    client ??= (async () => {
      const c = new pg.Client({ connectionString: url });
      c.on('error', () => (client = undefined));
      await c.connect();
      return c;
    })().catch((err: unknown) => {
      client = undefined;
      throw err;
    });
    return client;
  };

  async function merge(task: MergeTask): Promise<MergeOutput> {
    const design = designOf(task.runId, task.design);
    const db = await connect(task.databaseUrl);
    const page = (from: number, limit: number) =>
      db.query<{ chunk_index: number; text: string }>(
        `select chunk_index, result::text as text from run_chunks
         where run_id = $1 and state = 'done' and chunk_index >= $2 order by chunk_index limit $3`,
        [task.runId, from, limit],
      );
    const extras = (await page(EXTRAS_INDEX, 1)).rows[0];
    if (extras?.chunk_index !== EXTRAS_INDEX) throw new Error('the once-per-run results are not stored');
    const merger = job.createMerger(design, task.plan, JSON.parse(extras.text));
    const total = Math.ceil(task.plan.samples / task.plan.chunkSize);
    let next = 0;
    while (next < total) {
      const { rows } = await page(next, MERGE_PAGE);
      if (rows.length === 0 || rows[0]!.chunk_index !== next) break;
      for (const row of rows) {
        if (row.chunk_index !== next) break;
        merger.add(JSON.parse(row.text) as C);
        next++;
      }
    }
    if (next !== total) throw new Error(`chunk ${next} of ${total} is not stored`);
    const results = merger.finish();
    return { json: JSON.stringify(results), ...job.summarize(results) };
  }

  function handle(task: ChunkTask): string;
  function handle(task: MergeTask): Promise<MergeOutput>;
  function handle(task: ChunkTask | MergeTask): string | Promise<MergeOutput> {
    if (task.kind === 'merge') return merge(task);
    const design = designOf(task.runId, task.design);
    const out =
      task.chunkIndex === EXTRAS_INDEX
        ? job.runExtras(design, task.plan)
        : job.runChunk(design, task.plan, task.chunkIndex);
    return JSON.stringify(out);
  }
  return handle;
}
