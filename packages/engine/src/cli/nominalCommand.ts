import { readFile } from 'node:fs/promises';
import { parseDesign } from '../design/parseDesign.js';
import { nominalResults } from '../model/nominalResults.js';
import { largeSignalReport } from '../model/largeSignalReport.js';

/** Error whose message is the whole one-line report for the user. */
class InputError extends Error {}

/** Reads and validates a design file; throws InputError with a one-line message. */
export async function loadDesignFile(file: string | undefined) {
  if (!file) throw new InputError('missing design file (usage: sigmatail nominal FILE.json)');
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (err) {
    throw new InputError(`cannot read ${file}: ${(err as NodeJS.ErrnoException).code ?? String(err)}`);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (err) {
    throw new InputError(`${file} is not valid JSON: ${(err as Error).message}`);
  }
  const r = parseDesign(json);
  if (!r.ok)
    throw new InputError(
      `invalid design ${file}: ${r.errors.map((e) => `${e.path}: ${e.message}`).join('; ')}`,
    );
  return r.design;
}

/** JSON has no Infinity/NaN: absent or unbounded values print as null. */
const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

/** A copy with every non-finite number as null. */
const jsonSafe = (v: unknown): unknown =>
  JSON.parse(JSON.stringify(v, (_k, x: unknown) => (typeof x === 'number' ? finiteOrNull(x) : x)));

/**
 * `sigmatail nominal FILE.json`: prints one JSON object (SI units) with the gains, impedances,
 * balance, DC point, frequency metrics, warnings, trim and the large-signal figures (drive and
 * swing limits, H2/H3/THD of each output at half the symmetrical drive limit; plate and cathode
 * for a split-load design). Exit 0 ok, 1 no valid bias point (diagnosis printed),
 * 2 bad input (one line on stderr).
 */
export async function nominalCommand(args: string[]): Promise<number> {
  let design;
  try {
    design = await loadDesignFile(args[0]);
  } catch (err) {
    if (!(err instanceof InputError)) throw err;
    process.stderr.write(`sigmatail nominal: ${err.message.replace(/\s*\n\s*/g, ' ')}\n`);
    return 2;
  }
  const r = nominalResults(design);
  const metrics = Object.fromEntries(Object.entries(r.metrics).map(([k, v]) => [k, finiteOrNull(v)]));
  const trim = r.trim && {
    rl2: finiteOrNull(r.trim.exact.rl2),
    balanceDb: finiteOrNull(r.trim.exact.balanceDb),
    e24: { rl2: finiteOrNull(r.trim.e24.rl2), balanceDb: finiteOrNull(r.trim.e24.balanceDb) },
    e96: { rl2: finiteOrNull(r.trim.e96.rl2), balanceDb: finiteOrNull(r.trim.e96.balanceDb) },
  };
  const report = {
    design: design.name,
    tube: design.tube.type,
    status: r.status,
    ...(r.diagnosis ? { diagnosis: r.diagnosis } : {}),
    ...metrics,
    warnings: r.warnings.map((w) => w.message),
    ratings: r.ratings,
    trim: trim ?? null,
    largeSignal: r.status === 'ok' ? jsonSafe(largeSignalReport(design)) : null,
  };
  process.stdout.write(`${JSON.stringify(report, null, 2)}\n`);
  return r.status === 'ok' ? 0 : 1;
}
