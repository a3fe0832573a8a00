import { CAPACITOR_PARTS, type PartName, type ResolvedDesign } from '../design/designSchema.js';
import { INPUTS } from '../model/stageKernel.js';
import { normalQuantile } from '../spread/normalQuantile.js';
import { DEFAULT_RESISTOR_KIND } from '../values/resistorKinds.js';
import type { AgeingScenario } from './ageingScenario.js';
import { commonUniforms, tubeColumns } from './commonDraws.js';
import { rejectPpm } from './rejectBounds.js';
import { createSampleJudge, evaluateAll, samplePasses, type SampleJudge } from './sampleJudge.js';
import { studyColumns } from './studyColumns.js';

/**
 * How one spec fares: share passing, metric mean and sd (metric unit), and the margin: distance
 * from the mean to the nearest limit (metric unit; negative when the mean is outside), also in sd.
 */
export type SpecMargin = {
  metric: string;
  /** The spec's frequency (Hz) for a frequency metric, else null. */
  frequency: number | null;
  label: string | null;
  min: number | null;
  max: number | null;
  passRate: number;
  mean: number;
  sd: number;
  margin: number;
  marginSd: number;
};

/** The design's reject rate (PPM, with its Wilson interval) and per-spec margins. */
export type AgeingSide = {
  fails: number;
  rejectPpm: number;
  lowPpm: number;
  highPpm: number;
  specs: SpecMargin[];
};

/** New and aged, side by side, on the same units. */
export type AgeingResult = {
  samples: number;
  seed: string;
  scenario: AgeingScenario;
  asNew: AgeingSide;
  aged: AgeingSide;
};

/**
 * Applies an ageing scenario to the same sampled units (common random numbers): each unit's
 * resistors drift by their kind's shift ± sd (percent of value, normal), each tube section loses
 * emission (percent, normal, clamped to 0..95 %), scaling its perveance by (1 − loss). The design's
 * own pairing rule chooses the tubes when new.
 *
 * @example applyAgeing(design, DEFAULT_AGEING_SCENARIO).aged.rejectPpm
 */
export function applyAgeing(
  design: ResolvedDesign,
  scenario: AgeingScenario,
  options: { samples?: number; seed?: string } = {},
): AgeingResult {
  const n = options.samples ?? 20_000;
  const seed = options.seed ?? 'ageing';
  const judge = createSampleJudge(design);
  const pairing = design.tube.spread.pairing;
  const tubes = tubeColumns(
    design,
    pairing ? { kind: 'matched', ...pairing } : { kind: 'unmatched' },
    seed,
    n,
  );
  const fresh = studyColumns(design, tubes, judge.kernel.nominalInputs(), seed, n);
  const aged = fresh.map((col, i) => {
    const id = INPUTS[i];
    const part = design.parts[id as PartName];
    // Resistors drift by kind; capacitors are left as made (the scenario has no capacitor ageing yet).
    if (part && !(CAPACITOR_PARTS as readonly string[]).includes(id)) {
      const d = scenario.resistors[part.kind ?? DEFAULT_RESISTOR_KIND];
      const z = commonUniforms(seed, 'ageing', id, n);
      return col.map((v, s) => v * (1 + (d.shift + d.sd * normalQuantile(z[s])) / 100));
    }
    if (id === 'perv1' || id === 'perv2') {
      const z = commonUniforms(seed, 'ageing', id, n);
      const e = scenario.emission;
      return col.map(
        (v, s) => v * (1 - Math.min(95, Math.max(0, e.shift + e.sd * normalQuantile(z[s]))) / 100),
      );
    }
    return col;
  });
  return {
    samples: n,
    seed,
    scenario,
    asNew: side(design, judge, fresh, n),
    aged: side(design, judge, aged, n),
  };
}

function side(design: ResolvedDesign, judge: SampleJudge, columns: Float64Array[], n: number): AgeingSide {
  const out = evaluateAll(judge, columns, n);
  let fails = 0;
  for (let s = 0; s < n; s++) if (!samplePasses(judge, out, s)) fails++;
  const r = rejectPpm(fails, n);
  const specs = design.specs.map((spec, i) => {
    const col = out[judge.specMetric[i]];
    let pass = 0;
    let sum = 0;
    let sum2 = 0;
    let count = 0;
    for (let s = 0; s < n; s++) {
      const x = col[s];
      if (x >= judge.lo[i] && x <= judge.hi[i]) pass++;
      if (!Number.isFinite(x)) continue;
      count++;
      sum += x;
      sum2 += x * x;
    }
    const mean = count > 0 ? sum / count : NaN;
    const sd = count > 1 ? Math.sqrt(Math.max(0, (sum2 - count * mean * mean) / (count - 1))) : NaN;
    const margin = Math.min(
      spec.max === undefined ? Infinity : spec.max - mean,
      spec.min === undefined ? Infinity : mean - spec.min,
    );
    return {
      metric: spec.metric,
      frequency: spec.frequency ?? null,
      label: spec.label ?? null,
      min: spec.min ?? null,
      max: spec.max ?? null,
      passRate: pass / n,
      mean,
      sd,
      margin,
      marginSd: sd > 0 ? margin / sd : NaN,
    };
  });
  return { fails, rejectPpm: r.ppm, lowPpm: r.low, highPpm: r.high, specs };
}
