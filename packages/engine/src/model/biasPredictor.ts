import { solveStageBias, type StageContext, type StageInputs } from './stageEvaluator.js';

/** Inputs that move the DC point, in the DC_* slot order of stageEvaluator. */
const DC_INPUTS = ['rl1', 'rl2', 'rk', 'rt', 'perv1', 'perv2', 'mu1', 'mu2'] as const;

/** Second-order start point for the per-sample bias solve. */
export interface BiasPredictor {
  /** Writes predicted Ia1, Ia2 (A) for inputs `x` into ctx.bp. */
  predictInto(x: StageInputs): void;
  /** Same as predictInto, the DC inputs given in the DC_* slots of `dcv` (per-sample path). */
  predictArr(dcv: Float64Array): void;
}

/**
 * Builds a quadratic predictor of the plate currents around the nominal point: first and (diagonal)
 * second derivatives of Ia with respect to each DC input's relative change, plus the perv1·perv2
 * cross term, by central differences of full solves (done once per kernel). Warm-starting Newton from
 * nominal alone is poor for long tails, where a few percent on Rt moves Vk by volts and the first
 * residual is large; the predicted start is off only to third order (and by resistor × tube cross terms), so Newton
 * usually needs one step.
 *
 * @example
 * const pred = createBiasPredictor(ctx, nominal);
 * pred.predictInto(x); solveBiasInto(ctx.bias, ctx.bp, true);
 */
export function createBiasPredictor(ctx: StageContext, nominal: StageInputs): BiasPredictor {
  const status = solveStageBias(ctx, nominal, false);
  const ia1 = ctx.bp.ia1;
  const ia2 = ctx.bp.ia2;
  const s1 = new Float64Array(DC_INPUTS.length);
  const s2 = new Float64Array(DC_INPUTS.length);
  // Half the second derivatives d²Ia/dd_k² (diagonal), and the perv1·perv2 cross term: tube
  // spreads are the widest (10 % and more), so their curvature is worth carrying.
  const h1 = new Float64Array(DC_INPUTS.length);
  const h2 = new Float64Array(DC_INPUTS.length);
  let x1 = 0;
  let x2 = 0;
  const nom = new Float64Array(DC_INPUTS.map((k) => nominal[k]));
  const h = 0.01;
  if (status === 'ok') {
    DC_INPUTS.forEach((k, i) => {
      const up = solveAt(ctx, { ...nominal, [k]: nominal[k] * (1 + h) });
      const dn = solveAt(ctx, { ...nominal, [k]: nominal[k] * (1 - h) });
      if (up && dn) {
        s1[i] = (up[0] - dn[0]) / (2 * h);
        s2[i] = (up[1] - dn[1]) / (2 * h);
        h1[i] = (up[0] - 2 * ia1 + dn[0]) / (2 * h * h);
        h2[i] = (up[1] - 2 * ia2 + dn[1]) / (2 * h * h);
      }
    });
    const pp = solveAt(ctx, { ...nominal, perv1: nominal.perv1 * (1 + h), perv2: nominal.perv2 * (1 + h) });
    const pm = solveAt(ctx, { ...nominal, perv1: nominal.perv1 * (1 + h), perv2: nominal.perv2 * (1 - h) });
    const mp = solveAt(ctx, { ...nominal, perv1: nominal.perv1 * (1 - h), perv2: nominal.perv2 * (1 + h) });
    const mm = solveAt(ctx, { ...nominal, perv1: nominal.perv1 * (1 - h), perv2: nominal.perv2 * (1 - h) });
    if (pp && pm && mp && mm) {
      x1 = (pp[0] - pm[0] - mp[0] + mm[0]) / (4 * h * h);
      x2 = (pp[1] - pm[1] - mp[1] + mm[1]) / (4 * h * h);
    }
  }
  const dcv = new Float64Array(DC_INPUTS.length);
  function predictArr(v: Float64Array): void {
    const d0 = v[0] / nom[0] - 1;
    const d1 = v[1] / nom[1] - 1;
    const d2 = v[2] / nom[2] - 1;
    const d3 = v[3] / nom[3] - 1;
    const d4 = v[4] / nom[4] - 1;
    const d5 = v[5] / nom[5] - 1;
    const d6 = v[6] / nom[6] - 1;
    const d7 = v[7] / nom[7] - 1;
    const p1 =
      ia1 +
      d0 * (s1[0] + h1[0] * d0) +
      d1 * (s1[1] + h1[1] * d1) +
      d2 * (s1[2] + h1[2] * d2) +
      d3 * (s1[3] + h1[3] * d3) +
      d4 * (s1[4] + h1[4] * d4 + x1 * d5) +
      d5 * (s1[5] + h1[5] * d5) +
      d6 * (s1[6] + h1[6] * d6) +
      d7 * (s1[7] + h1[7] * d7);
    const p2 =
      ia2 +
      d0 * (s2[0] + h2[0] * d0) +
      d1 * (s2[1] + h2[1] * d1) +
      d2 * (s2[2] + h2[2] * d2) +
      d3 * (s2[3] + h2[3] * d3) +
      d4 * (s2[4] + h2[4] * d4 + x2 * d5) +
      d5 * (s2[5] + h2[5] * d5) +
      d6 * (s2[6] + h2[6] * d6) +
      d7 * (s2[7] + h2[7] * d7);
    // A prediction outside the physical range falls back to the nominal currents.
    ctx.bp.ia1 = p1 > 0 ? p1 : ia1;
    ctx.bp.ia2 = p2 > 0 ? p2 : ia2;
  }
  return {
    predictInto(x: StageInputs): void {
      DC_INPUTS.forEach((k, i) => (dcv[i] = x[k]));
      predictArr(dcv);
    },
    predictArr,
  };
}

function solveAt(ctx: StageContext, x: StageInputs): [number, number] | undefined {
  return solveStageBias(ctx, x, false) === 'ok' ? [ctx.bp.ia1, ctx.bp.ia2] : undefined;
}
