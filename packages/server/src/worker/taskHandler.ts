import pg from 'pg';
import { move } from 'piscina';
import { EXTRAS_INDEX, extrasPartOf, type JobPlan, type RunJob } from './runJob.js';

export type ChunkTask = { kind: 'chunk'; runId: string; design: unknown; plan: JobPlan; chunkIndex: number };
/** The merge reads the stored chunk results itself, page by page, so memory stays flat. */
export type MergeTask = { kind: 'merge'; runId: string; design: unknown; plan: JobPlan; databaseUrl: string };
export type MergeOutput = { json: string; validCount: number | null; jointYield: number | null };
/** A task's result: JSON text, or a chunk's bytes (moved to the main thread, not copied). */
export type ChunkOutput = string | Uint8Array;

/** Chunk results read per query while merging. */
const MERGE_PAGE = 32;

type StoredRow = { chunk_index: number; text: string | null; bin: Buffer | null };

/**
 * The function a pool thread runs. Chunk results travel back as bytes (or JSON text for a job
 * without a binary form), and the merge reads chunk results from the database in this thread, so
 * the worker's main thread (which keeps leases alive) never parses or holds large objects.
 */
export function createTaskHandler<D, C, R>(
  job: RunJob<D, C, R>,
  /** false returns a chunk's bytes as they are (called outside a pool, as tests do). */
  o: { transfer?: boolean } = {},
) {
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

  const decode = (design: D, row: StoredRow): C => {
    if (row.bin !== null) {
      if (!job.decodeChunk) throw new Error(`chunk ${row.chunk_index} is stored as bytes`);
      return job.decodeChunk(design, row.bin);
    }
    if (row.text === null) throw new Error(`chunk ${row.chunk_index} has no stored result`);
    return JSON.parse(row.text) as C;
  };

  /** The once-per-run results: one task's (runs queued before the split) or every part's. */
  async function extrasOf(db: pg.Client, task: MergeTask, design: D): Promise<unknown> {
    const { rows } = await db.query<{ chunk_index: number; state: string; text: string | null }>(
      `select chunk_index, state, result::text as text from run_chunks
       where run_id = $1 and chunk_index < 0 order by chunk_index desc`,
      [task.runId],
    );
    const missing = rows.find((r) => r.state !== 'done' || r.text === null);
    if (rows.length === 0 || missing) throw new Error('the once-per-run results are not stored');
    if (rows[0]!.chunk_index === EXTRAS_INDEX) return JSON.parse(rows[0]!.text!);
    const parts = rows.map((r, p) => {
      if (extrasPartOf(r.chunk_index) !== p) throw new Error(`once-per-run part ${p} is not queued`);
      return JSON.parse(r.text!) as unknown;
    });
    return job.assembleExtras(design, task.plan, parts);
  }

  async function merge(task: MergeTask): Promise<MergeOutput> {
    const design = designOf(task.runId, task.design);
    const db = await connect(task.databaseUrl);
    const page = (from: number, limit: number) =>
      db.query<StoredRow>(
        `select chunk_index, result::text as text, result_bin as bin from run_chunks
         where run_id = $1 and state = 'done' and chunk_index >= $2 order by chunk_index limit $3`,
        [task.runId, from, limit],
      );
    const merger = job.createMerger(design, task.plan, await extrasOf(db, task, design));
    const total = Math.ceil(task.plan.samples / task.plan.chunkSize);
    let next = 0;
    while (next < total) {
      const { rows } = await page(next, MERGE_PAGE);
      if (rows.length === 0 || rows[0]!.chunk_index !== next) break;
      for (const row of rows) {
        if (row.chunk_index !== next) break;
        merger.add(decode(design, row));
        next++;
      }
    }
    if (next !== total) throw new Error(`chunk ${next} of ${total} is not stored`);
    const results = merger.finish();
    return { json: JSON.stringify(results), ...job.summarize(results) };
  }

  function handle(task: ChunkTask): ChunkOutput;
  function handle(task: MergeTask): Promise<MergeOutput>;
  function handle(task: ChunkTask | MergeTask): ChunkOutput | Promise<MergeOutput> {
    if (task.kind === 'merge') return merge(task);
    const design = designOf(task.runId, task.design);
    const k = task.chunkIndex;
    if (k === EXTRAS_INDEX) return JSON.stringify(job.runExtras(design, task.plan));
    if (k < EXTRAS_INDEX) return JSON.stringify(job.runExtrasPart(design, task.plan, extrasPartOf(k)));
    const chunk = job.runChunk(design, task.plan, k);
    if (!job.encodeChunk) return JSON.stringify(chunk);
    const bytes = job.encodeChunk(design, chunk);
    return o.transfer === false ? bytes : (move(bytes) as Uint8Array);
  }
  return handle;
}
