import { SAMPLING_PLANS, MAX_SAMPLES, MIN_SAMPLES, MAX_SEED_LENGTH, type SamplingPlanId } from '../limits.js';
import { designSetup } from '../run/designSetup.js';
import { createRunAccumulator } from '../run/runAccumulator.js';
import { withMonteCarloSpread } from '../run/mergeSetupChunks.js';
import { chunkCount, DEFAULT_CHUNK_SIZE, type RunPlan } from '../run/runPlan.js';
import { runSetupChunk } from '../run/runSetupChunk.js';
import { setupExtras } from '../run/setupExtras.js';
import { largeSignalSpread } from '../run/largeSignalSpread.js';
import { loadDesignFile } from './nominalCommand.js';

/** Bad command-line input: the message is the whole one-line report. */
class ArgumentError extends Error {}

/**
 * Parses `FILE.json --samples N [--seed S] [--plan random|lhs|sobol] [--large-signal]`; throws
 * ArgumentError.
 */
export function parseRunArgs(args: readonly string[]): { file: string; plan: RunPlan } {
  let file: string | undefined;
  const opts: Record<string, string> = {};
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a.startsWith('--')) {
      const [name, inline] = a.slice(2).split('=', 2);
      if (name === 'large-signal') {
        opts[name] = 'on';
        continue;
      }
      if (!['samples', 'seed', 'plan'].includes(name)) throw new ArgumentError(`unknown option --${name}`);
      const value = inline ?? args[++i];
      if (value === undefined) throw new ArgumentError(`--${name} needs a value`);
      opts[name] = value;
    } else if (file === undefined) file = a;
    else throw new ArgumentError(`unexpected argument '${a}'`);
  }
  if (!file)
    throw new ArgumentError('missing design file (usage: sigmatail run FILE.json --samples N --seed S)');
  const samplesText = opts.samples;
  if (samplesText === undefined) throw new ArgumentError('--samples is required');
  const samples = /^\d+$/.test(samplesText) ? Number(samplesText) : NaN;
  if (!Number.isInteger(samples) || samples < MIN_SAMPLES || samples > MAX_SAMPLES) {
    throw new ArgumentError(`--samples must be an integer ${MIN_SAMPLES}..${MAX_SAMPLES}`);
  }
  const seed = opts.seed ?? '0';
  if (seed.length > MAX_SEED_LENGTH)
    throw new ArgumentError(`--seed must be at most ${MAX_SEED_LENGTH} characters`);
  const kind = opts.plan ?? 'random';
  if (!(SAMPLING_PLANS as readonly string[]).includes(kind)) {
    throw new ArgumentError(`--plan must be one of ${SAMPLING_PLANS.join('|')}`);
  }
  const plan: RunPlan = { samples, seed, plan: kind as SamplingPlanId, chunkSize: DEFAULT_CHUNK_SIZE };
  if (opts['large-signal']) plan.analyses = { largeSignal: true };
  return { file, plan };
}

/**
 * `sigmatail run FILE.json --samples N [--seed S] [--plan random|lhs|sobol] [--large-signal]` (seed
 * defaults to '0', plan to random; --large-signal adds the per-sample large-signal figures on the
 * first 32 samples). Runs every chunk in this process, merging as it goes (memory flat in N),
 * and prints one JSON object: the run results (per metric summary with quantiles and histogram,
 * per spec yield with Wilson and Clopper–Pearson intervals, PPM, Cp, Cpk, joint yield, influence,
 * variance indices, worst case beside the Monte Carlo spread). Exit 0 ok, 2 bad input (one line
 * on stderr).
 */
export async function runCommand(args: string[]): Promise<number> {
  let parsed;
  let setup;
  let design;
  try {
    parsed = parseRunArgs(args);
    design = await loadDesignFile(parsed.file);
    setup = designSetup(design);
  } catch (err) {
    process.stderr.write(
      `sigmatail run: ${(err instanceof Error ? err.message : String(err)).replace(/\s*\n\s*/g, ' ')}\n`,
    );
    return 2;
  }
  const { plan } = parsed;
  const acc = createRunAccumulator(setup, plan);
  const chunks = chunkCount(plan);
  for (let k = 0; k < chunks; k++) acc.add(runSetupChunk(setup, plan, k));
  const extras = setupExtras(setup, plan);
  if (plan.analyses?.largeSignal) extras.largeSignal = largeSignalSpread(design, setup, plan);
  const results = withMonteCarloSpread(acc.finish(extras));
  process.stdout.write(`${JSON.stringify(results)}\n`);
  return 0;
}
