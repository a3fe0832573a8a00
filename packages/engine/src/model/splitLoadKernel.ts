import type { ResolvedDesign } from '../design/designSchema.js';
import { createBiasPoint, type BiasCircuit } from './biasSolver.js';
import { METRIC_IDS, type MetricId } from './metrics.js';
import {
  G_A11,
  G_A12,
  G_SLOTS,
  G_ZIN,
  G_ZOUT1,
  G_ZOUT2,
  SS_MU1,
  SS_RG1,
  SS_RK,
  SS_RL1,
  SS_RLOAD1,
  SS_RLOAD2,
  SS_RP1,
  SS_RSOURCE,
  SS_RT,
  SS_SLOTS,
} from './reducedNodalGains.js';
import { solveSplitLoadBiasInto } from './splitLoadBias.js';
import { splitLoadGainsArr } from './splitLoadGains.js';
import { nominalStageInputs } from './stageEvaluator.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import type { InputId, StageKernel } from './stageKernel.js';

const col = (id: MetricId) => METRIC_IDS.indexOf(id);
/** Relative Newton step that ends a per-sample bias solve (as in the long-tailed-pair kernel). */
const SAMPLE_STEP_TOL = 1e-6;
/**
 * Metrics with no meaning for a single section with one input, always NaN for split-load: the
 * second input's gains (a21, a22), the mode gains and CMRR (gainDm, gainCm, cmrrDb), and the
 * second section's bias and small signal (ia2, va2, vgk2, pd2, gm2, rp2, mu2).
 */
export const SPLIT_LOAD_NAN_METRICS: readonly MetricId[] = [
  'a21',
  'a22',
  'gainDm',
  'gainCm',
  'cmrrDb',
  'ia2',
  'va2',
  'vgk2',
  'pd2',
  'gm2',
  'rp2',
  'mu2',
];

/**
 * The stage kernel of a split-load (cathodyne) design, selected by createStageKernel for topology
 * 'split-load'. Same inputs and metric ids as the long-tailed-pair kernel: a11 = plate gain,
 * a12 = cathode gain (from the source), gainDiff = a11 − a12, balanceDb = 20·log10(|a12|/|a11|),
 * zout1 = plate, zout2 = cathode, zin = bootstrapped grid leak, ia1/va1/vk/vgk1/pd1/gm1/rp1/mu1 of
 * the one section, vhk = Vk − heater; {@link SPLIT_LOAD_NAN_METRICS} are NaN. Per sample the DC
 * point is solved with the Koren model (solveSplitLoadBiasInto, warm-started from nominal), gm
 * and rp taken there, and the small signal solved in closed form (splitLoadGainsArr). No frequency
 * analysis: the corner and frequency columns in `metrics` beyond METRIC_IDS are written NaN.
 * With `dcPerSample: false` the bias is solved once at nominal and mu/rp scaled per sample as the
 * long-tailed-pair kernel does.
 *
 * @example
 * const k = createSplitLoadKernel(design, METRIC_IDS, true);
 */
export function createSplitLoadKernel(
  design: ResolvedDesign,
  inputs: readonly InputId[],
  metrics: readonly string[],
  dcPerSample: boolean,
): StageKernel {
  const nominal = nominalStageInputs(design);
  const nominalArray = Float64Array.from(inputs.map((id) => nominal[id]));
  const tube = TUBE_CATALOG[design.tube.type];
  const circuit: BiasCircuit = {
    ...{ capCoupled: true, bPlus: design.supply.bPlus, tail: design.supply.tail, vg1: 0, vg2: 0 },
    ...{ rl1: nominal.rl1, rl2: nominal.rl2, rk: nominal.rk, rt: nominal.rt, tube: tube.model },
    ...{ perv1: 1, perv2: 1, muScale1: 1, muScale2: 1 },
  };
  const bp = createBiasPoint();
  solveSplitLoadBiasInto(circuit, bp, false);
  const nb = { ...bp };
  const nominalValid = nb.status === 'ok';
  const heater = design.supply.heater ?? 0;
  const v = new Float64Array(SS_SLOTS);
  const g = new Float64Array(G_SLOTS);
  const at = (id: InputId) => inputs.indexOf(id);
  const idx = {
    rl1: at('rl1'),
    rk: at('rk'),
    rt: at('rt'),
    rg1: at('rg1'),
    rload1: at('rload1'),
    rload2: at('rload2'),
    rsource: at('rsource'),
    mu1: at('mu1'),
    perv1: at('perv1'),
  };
  const nanCols = SPLIT_LOAD_NAN_METRICS.map(col);
  const extraCols = metrics.map((_, m) => m).filter((m) => m >= METRIC_IDS.length);

  function evaluate(x: readonly Float64Array[], n: number, out: readonly Float64Array[]): void {
    const o = (id: MetricId) => out[col(id)];
    const [o_a11, o_a12, o_gainDiff, o_balanceDb, o_zout1, o_zout2, o_zin] = (
      ['a11', 'a12', 'gainDiff', 'balanceDb', 'zout1', 'zout2', 'zin'] as const
    ).map(o);
    const [o_ia1, o_va1, o_vk, o_vgk1, o_pd1, o_vhk, o_gm1, o_rp1, o_mu1, o_valid] = (
      ['ia1', 'va1', 'vk', 'vgk1', 'pd1', 'vhk', 'gm1', 'rp1', 'mu1', 'valid'] as const
    ).map(o);
    for (let s = 0; s < n; s++) {
      for (const c of nanCols) out[c][s] = Number.NaN;
      for (const c of extraCols) out[c][s] = Number.NaN;
      const rl1 = x[idx.rl1][s];
      const rk = x[idx.rk][s];
      const rt = x[idx.rt][s];
      const rg1 = x[idx.rg1][s];
      const rload1 = x[idx.rload1][s];
      const rload2 = x[idx.rload2][s];
      const rsource = x[idx.rsource][s];
      const xmu = x[idx.mu1][s];
      const perv = x[idx.perv1][s];
      if (!(rg1 > 0 && rload1 > 0 && rload2 > 0 && rsource >= 0)) {
        writeInvalid(out, s);
        continue;
      }
      let gm: number, rp: number, ia: number, va: number, vk: number, vgk: number;
      if (dcPerSample) {
        circuit.rl1 = rl1;
        circuit.rk = rk;
        circuit.rt = rt;
        circuit.perv1 = perv;
        circuit.muScale1 = xmu;
        // Each sample starts from the nominal point, not the previous sample's: a sample's bits
        // then depend on its inputs only, not on what the thread evaluated before (chunk order,
        // parallel once-per-run parts, regenerated exports).
        bp.ia1 = nb.ia1;
        if (solveSplitLoadBiasInto(circuit, bp, nominalValid, SAMPLE_STEP_TOL) !== 'ok') {
          writeInvalid(out, s);
          continue;
        }
        gm = bp.gm1;
        rp = 1 / bp.ga1;
        ia = bp.ia1;
        va = bp.va1;
        vk = bp.vk;
        vgk = bp.vgk1;
      } else {
        if (!nominalValid || !(rl1 > 0 && rk >= 0 && rt > 0 && perv > 0 && xmu > 0)) {
          writeInvalid(out, s);
          continue;
        }
        rp = 1 / (nb.ga1 * perv);
        gm = ((nb.gm1 / nb.ga1) * xmu) / rp;
        ia = nb.ia1;
        va = nb.va1;
        vk = nb.vk;
        vgk = nb.vgk1;
      }
      const mu = gm * rp;
      v[SS_MU1] = mu;
      v[SS_RP1] = rp;
      v[SS_RL1] = rl1;
      v[SS_RK] = rk;
      v[SS_RT] = rt;
      v[SS_RG1] = rg1;
      v[SS_RLOAD1] = rload1;
      v[SS_RLOAD2] = rload2;
      v[SS_RSOURCE] = rsource;
      splitLoadGainsArr(v, g);
      const a11 = g[G_A11];
      const a12 = g[G_A12];
      o_a11[s] = a11;
      o_a12[s] = a12;
      o_gainDiff[s] = a11 - a12;
      o_balanceDb[s] = 20 * Math.log10(Math.abs(a12) / Math.abs(a11));
      o_zout1[s] = g[G_ZOUT1];
      o_zout2[s] = g[G_ZOUT2];
      o_zin[s] = g[G_ZIN];
      o_ia1[s] = ia;
      o_va1[s] = va;
      o_vk[s] = vk;
      o_vgk1[s] = vgk;
      o_pd1[s] = ia * (va - vk);
      o_vhk[s] = vk - heater;
      o_gm1[s] = gm;
      o_rp1[s] = rp;
      o_mu1[s] = mu;
      o_valid[s] = 1;
    }
  }

  return { inputs, metrics, nominalInputs: () => nominalArray.slice(), evaluate };
}

function writeInvalid(out: readonly Float64Array[], s: number): void {
  for (let m = 0; m < out.length; m++) out[m][s] = Number.NaN;
  out[col('valid')][s] = 0;
}
