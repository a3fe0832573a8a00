import { nominalMetrics } from '../influence/nominalMetrics.js';
import {
  combineVarianceIndices,
  varianceIndicesGroup,
  type VarianceIndicesGroup,
} from '../influence/varianceIndices.js';
import { worstCase } from '../worstcase/worstCase.js';
import { influenceOfRun } from './influenceOfRun.js';
import { largeSignalSpread } from './largeSignalSpread.js';
import type { RunPlan } from './runPlan.js';
import { finiteOrNull, type RunResults } from './runResults.js';
import type { RunSetup } from './runSetup.js';

/** Keys of RunResults the once-per-run work fills, in the order they appear in the results. */
const EXTRAS_KEYS = ['nominal', 'influence', 'varianceIndices', 'worstCase', 'largeSignal'] as const;
type ExtrasKey = (typeof EXTRAS_KEYS)[number];

/** Groups the variance-based indices are cut into (each evaluates A and B again: M·2 more evaluations). */
export const VARIANCE_GROUPS = 3;

/**
 * One piece of the once-per-run work, computed on its own (a server worker runs each as its own
 * task, in parallel with the chunks) and put into the results by `key`. Parts that share a key
 * (the variance index groups) are combined. `run` returns plain JSON, or null when the plan or the
 * design leave the part out.
 */
export type ExtrasPart = {
  key: ExtrasKey;
  run(setup: RunSetup, plan: RunPlan): unknown;
};

/** One part's output as stored between tasks: its key and value (null = left out). */
export type ExtrasPartValue = { key: string; value: unknown };

const on = (plan: RunPlan, a: 'influence' | 'varianceIndices' | 'worstCase') => plan.analyses?.[a] !== false;

/** The varied draw dimensions of group g (round robin, so groups cost about the same). */
function groupDims(setup: RunSetup, g: number): number[] {
  return setup.model.dims.flatMap((_n, i) => (i % VARIANCE_GROUPS === g ? [i] : []));
}

/**
 * The parts, most expensive last: a server queue hands out the last part first, so the longest
 * tasks start first. Adding a part is one entry here (and a key above if it is a new one).
 */
export const EXTRAS_PARTS: readonly ExtrasPart[] = [
  {
    key: 'nominal',
    run: ({ model }) => {
      const nominal = nominalMetrics(model);
      return Object.fromEntries(model.kernel.metrics.map((id, m) => [id, finiteOrNull(nominal[m])]));
    },
  },
  {
    key: 'largeSignal',
    // Needs the design itself (designSetup keeps it on the setup); largeSignalReport dispatches
    // on the topology: the pair and the split-load alike.
    run: (setup, plan) =>
      plan.analyses?.largeSignal === true && setup.design
        ? largeSignalSpread(setup.design, setup, plan)
        : null,
  },
  { key: 'worstCase', run: (setup, plan) => (on(plan, 'worstCase') ? worstCase(setup.model) : null) },
  ...Array.from({ length: VARIANCE_GROUPS }, (_x, g): ExtrasPart => ({
    key: 'varianceIndices',
    run: (setup, plan) => {
      const dims = groupDims(setup, g);
      return on(plan, 'varianceIndices') && dims.length > 0
        ? varianceIndicesGroup(setup.model, plan.seed, dims)
        : null;
    },
  })),
  { key: 'influence', run: (setup, plan) => (on(plan, 'influence') ? influenceOfRun(setup, plan) : null) },
];

/**
 * Computes part `part` (index into EXTRAS_PARTS) of a run's once-per-run work. Throws RangeError
 * for an index outside the list.
 *
 * @example runExtrasPart(setup, plan, 0) // { key: 'nominal', value: { gainDiff: 48.2, ... } }
 */
export function runExtrasPart(setup: RunSetup, plan: RunPlan, part: number): ExtrasPartValue {
  const p = EXTRAS_PARTS[part];
  if (!Number.isInteger(part) || p === undefined)
    throw new RangeError(`part must be an integer 0..${EXTRAS_PARTS.length - 1}`);
  return { key: p.key, value: p.run(setup, plan) };
}

/**
 * Puts computed parts into the results' once-per-run fields, keys in results order, whatever
 * order the parts come in. Same object as computing everything in one go.
 *
 * @example assembleExtras(setup, EXTRAS_PARTS.map((_p, i) => runExtrasPart(setup, plan, i)))
 */
export function assembleExtras(setup: RunSetup, parts: readonly ExtrasPartValue[]): Partial<RunResults> {
  const byKey = new Map<string, unknown[]>();
  for (const p of parts) {
    if (p.value === null || p.value === undefined) continue;
    byKey.set(p.key, [...(byKey.get(p.key) ?? []), p.value]);
  }
  const extras: Record<string, unknown> = {};
  for (const key of EXTRAS_KEYS) {
    const values = byKey.get(key);
    if (!values) continue;
    extras[key] =
      key === 'varianceIndices'
        ? combineVarianceIndices(setup.model, values as VarianceIndicesGroup[])
        : values[0];
  }
  return extras as Partial<RunResults>;
}
