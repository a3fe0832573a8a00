import type { ResolvedDesign } from '../design/designSchema.js';
import { METRIC_IDS, METRICS, type MetricId, type MetricInfo } from './metrics.js';
import {
  createStageContext,
  nominalStageInputs,
  solveStageBias,
  stageGains,
  type StageInputs,
} from './stageEvaluator.js';

export { METRICS, METRIC_IDS, type MetricId, type MetricInfo };

/**
 * Kernel inputs in column order. mu1/mu2 multiply the section's model mu (nominal 1); perv1/perv2
 * multiply its plate-current scale (nominal 1). Resistances in ohms; absent loads are Infinity,
 * an absent source resistance is 0.
 *
 * @example
 * INPUTS.indexOf('rk'); // 2
 */
export const INPUTS = [
  'rl1',
  'rl2',
  'rk',
  'rt',
  'rg1',
  'rg2',
  'rload1',
  'rload2',
  'rsource',
  'mu1',
  'mu2',
  'perv1',
  'perv2',
] as const;

/** One of {@link INPUTS}. */
export type InputId = (typeof INPUTS)[number];

/** The per-sample model Monte Carlo calls. */
export interface StageKernel {
  /** Input columns, {@link INPUTS} order. */
  readonly inputs: readonly InputId[];
  /** Output columns, {@link METRIC_IDS} order. */
  readonly metrics: readonly MetricId[];
  /** One nominal value per input. */
  nominalInputs(): Float64Array;
  /** In place, allocation-free: inputs[i][s] is input i of sample s; writes out[m][s] for s < n. */
  evaluate(inputs: readonly Float64Array[], n: number, out: readonly Float64Array[]): void;
}

const M = Object.fromEntries(METRIC_IDS.map((id, i) => [id, i])) as Record<MetricId, number>;

/**
 * Creates the stage kernel of a design. Per sample it solves the DC point (warm-started Newton
 * from the nominal solution), takes gm, rp and mu from the triode model at that bias, and solves
 * the small signal (closed form when exact, else the hand-reduced nodal solve). With
 * `dcPerSample: false` the bias is solved once at nominal; per sample only the small signal is
 * solved, with mu scaled by the mu multiplier and rp divided by the perveance multiplier
 * (a first-order approximation). A sample without a valid bias point gets valid = 0 and NaN
 * elsewhere.
 *
 * @example
 * const k = createStageKernel(design);
 * const inputs = k.inputs.map((_, i) => new Float64Array(n).fill(k.nominalInputs()[i]));
 * const out = k.metrics.map(() => new Float64Array(n));
 * k.evaluate(inputs, n, out); // out[METRIC_IDS.indexOf('balanceDb')][s] in dB
 */
export function createStageKernel(design: ResolvedDesign, options?: { dcPerSample?: boolean }): StageKernel {
  const dcPerSample = options?.dcPerSample ?? true;
  const ctx = createStageContext(design);
  const nominal = nominalStageInputs(design);
  const nominalArray = Float64Array.from(INPUTS.map((id) => nominal[id]));
  solveStageBias(ctx, nominal, false);
  const nb = { ...ctx.bp };
  const nominalValid = nb.status === 'ok';
  const x: StageInputs = { ...nominal };
  const heater = ctx.heater;

  function evaluate(inputs: readonly Float64Array[], n: number, out: readonly Float64Array[]): void {
    const bp = ctx.bp;
    for (let s = 0; s < n; s++) {
      x.rl1 = inputs[0][s];
      x.rl2 = inputs[1][s];
      x.rk = inputs[2][s];
      x.rt = inputs[3][s];
      x.rg1 = inputs[4][s];
      x.rg2 = inputs[5][s];
      x.rload1 = inputs[6][s];
      x.rload2 = inputs[7][s];
      x.rsource = inputs[8][s];
      x.mu1 = inputs[9][s];
      x.mu2 = inputs[10][s];
      x.perv1 = inputs[11][s];
      x.perv2 = inputs[12][s];
      let gm1: number, gm2: number, rp1: number, rp2: number;
      if (dcPerSample) {
        bp.ia1 = nb.ia1;
        bp.ia2 = nb.ia2;
        if (solveStageBias(ctx, x, nominalValid) !== 'ok') {
          writeInvalid(out, s);
          continue;
        }
        gm1 = bp.gm1;
        gm2 = bp.gm2;
        rp1 = 1 / bp.ga1;
        rp2 = 1 / bp.ga2;
      } else {
        if (!nominalValid) {
          writeInvalid(out, s);
          continue;
        }
        rp1 = 1 / (nb.ga1 * x.perv1);
        rp2 = 1 / (nb.ga2 * x.perv2);
        gm1 = ((nb.gm1 / nb.ga1) * x.mu1) / rp1;
        gm2 = ((nb.gm2 / nb.ga2) * x.mu2) / rp2;
      }
      const src = dcPerSample ? bp : nb;
      const mu1 = gm1 * rp1;
      const mu2 = gm2 * rp2;
      const g = stageGains(ctx, x, mu1, mu2, rp1, rp2);
      out[M.a11][s] = g.a11;
      out[M.a12][s] = g.a12;
      out[M.a21][s] = g.a21;
      out[M.a22][s] = g.a22;
      out[M.gainDiff][s] = g.a11 - g.a12;
      out[M.balanceDb][s] = 20 * Math.log10(Math.abs(g.a12) / Math.abs(g.a11));
      out[M.zout1][s] = g.zout1;
      out[M.zout2][s] = g.zout2;
      out[M.zin][s] = g.zin;
      const dm = 0.5 * (g.a11 - g.a12 - g.a21 + g.a22);
      const cm = 0.5 * (g.a11 + g.a12 + g.a21 + g.a22);
      out[M.gainDm][s] = dm;
      out[M.gainCm][s] = cm;
      out[M.cmrrDb][s] = 20 * Math.log10(Math.abs(dm) / Math.abs(cm));
      out[M.ia1][s] = src.ia1;
      out[M.ia2][s] = src.ia2;
      out[M.va1][s] = src.va1;
      out[M.va2][s] = src.va2;
      out[M.vk][s] = src.vk;
      out[M.vgk1][s] = src.vgk1;
      out[M.vgk2][s] = src.vgk2;
      out[M.pd1][s] = src.ia1 * (src.va1 - src.vk);
      out[M.pd2][s] = src.ia2 * (src.va2 - src.vk);
      out[M.vhk][s] = src.vk - heater;
      out[M.gm1][s] = gm1;
      out[M.gm2][s] = gm2;
      out[M.rp1][s] = rp1;
      out[M.rp2][s] = rp2;
      out[M.mu1][s] = mu1;
      out[M.mu2][s] = mu2;
      out[M.valid][s] = 1;
    }
  }

  return {
    inputs: INPUTS,
    metrics: METRIC_IDS,
    nominalInputs: () => nominalArray.slice(),
    evaluate,
  };
}

function writeInvalid(out: readonly Float64Array[], s: number): void {
  for (let m = 0; m < out.length; m++) out[m][s] = Number.NaN;
  out[M.valid][s] = 0;
}
