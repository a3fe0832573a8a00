import type { ResolvedDesign } from '../design/designSchema.js';
import { createBiasPoint, type BiasCircuit } from './biasSolver.js';
import { METRIC_IDS, type MetricId } from './metrics.js';
import { writeAcColumns, writeNominalCapacitors, type acColumns } from './acColumns.js';
import {
  AC_CGK1,
  AC_CGP1,
  AC_CIN,
  AC_COUT1,
  AC_COUT2,
  AC_CPK1,
  AC_CSTRAY1,
  AC_CSTRAY2,
  AC_SLOTS,
  H_SLOTS,
} from './acResponse.js';
import { cornerFrequencyArr, nominalCornerStarts } from './cornerFrequency.js';
import { splitLoadResponseArr } from './splitLoadResponse.js';
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
 * and rp taken there, and the small signal solved in closed form (splitLoadGainsArr). Then the
 * frequency response (splitLoadResponseArr: cin, cout1/cout2 into the loads, the strays, the
 * section's Cgk, Cgp, Cpk from the catalog): the frequency columns `ac.columns` (spec frequencies
 * and the band) and, with `corners`, the −3 dB points after METRIC_IDS by the same warm-started
 * secant as the long-tailed pair (cornerFrequencyArr from the nominal corners).
 * With `dcPerSample: false` the bias is solved once at nominal and mu/rp scaled per sample as the
 * long-tailed-pair kernel does.
 *
 * @example
 * const k = createSplitLoadKernel(design, INPUTS, METRIC_IDS, { dcPerSample: true, corners: false, ac });
 */
export function createSplitLoadKernel(
  design: ResolvedDesign,
  inputs: readonly InputId[],
  metrics: readonly string[],
  options: { dcPerSample: boolean; corners: boolean; ac: ReturnType<typeof acColumns> },
): StageKernel {
  const { dcPerSample, corners, ac } = options;
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
  const v = new Float64Array(AC_SLOTS);
  const g = new Float64Array(G_SLOTS);
  const h = new Float64Array(H_SLOTS);
  // The section's interelectrode capacitances (catalog; no spread).
  v[AC_CGK1] = tube.capacitance.cin;
  v[AC_CGP1] = tube.capacitance.cgp;
  v[AC_CPK1] = tube.capacitance.cout;
  const nomCorners = nominalCorners();
  const lowCorners =
    corners &&
    !(
      nominal.cin === Number.POSITIVE_INFINITY &&
      nominal.cout1 === Number.POSITIVE_INFINITY &&
      nominal.cout2 === Number.POSITIVE_INFINITY
    );
  const acFreq = ac.frequencies;
  const acCol = ac.columns;
  const corner0 = METRIC_IDS.length;
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
    cin: at('cin'),
    cout1: at('cout1'),
    cout2: at('cout2'),
    cstray1: at('cstray1'),
    cstray2: at('cstray2'),
  };
  const nanCols = SPLIT_LOAD_NAN_METRICS.map(col);

  /** Nominal −3 dB points and slopes, the per-sample searches' start (see nominalCornerStarts). */
  function nominalCorners(): Float64Array {
    if (!corners || !nominalValid) return Float64Array.of(1e3, 1e3, 1e3, 1e3, 0, 0, 0, 0);
    writeSmallSignal(nb.gm1 / nb.ga1, 1 / nb.ga1, nominal);
    writeNominalCapacitors(nominal, v);
    splitLoadGainsArr(v, g);
    return nominalCornerStarts(splitLoadResponseArr, v, Math.abs(g[G_A11]), Math.abs(g[G_A12]), h);
  }

  function writeSmallSignal(
    mu: number,
    rp: number,
    r: { rl1: number; rk: number; rt: number; rg1: number; rload1: number; rload2: number; rsource: number },
  ): void {
    v[SS_MU1] = mu;
    v[SS_RP1] = rp;
    v[SS_RL1] = r.rl1;
    v[SS_RK] = r.rk;
    v[SS_RT] = r.rt;
    v[SS_RG1] = r.rg1;
    v[SS_RLOAD1] = r.rload1;
    v[SS_RLOAD2] = r.rload2;
    v[SS_RSOURCE] = r.rsource;
  }

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
      const rl1 = x[idx.rl1][s];
      const rk = x[idx.rk][s];
      const rt = x[idx.rt][s];
      const rg1 = x[idx.rg1][s];
      const rload1 = x[idx.rload1][s];
      const rload2 = x[idx.rload2][s];
      const rsource = x[idx.rsource][s];
      const xmu = x[idx.mu1][s];
      const perv = x[idx.perv1][s];
      const cin = x[idx.cin][s];
      const cout1 = x[idx.cout1][s];
      const cout2 = x[idx.cout2][s];
      const cstray1 = x[idx.cstray1][s];
      const cstray2 = x[idx.cstray2][s];
      if (
        !(rg1 > 0 && rload1 > 0 && rload2 > 0 && rsource >= 0) ||
        !(cin > 0 && cout1 > 0 && cout2 > 0 && cstray1 >= 0 && cstray2 >= 0)
      ) {
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
      // Frequency response: the capacitors join the small-signal circuit already in v.
      v[AC_CIN] = cin;
      v[AC_COUT1] = cout1;
      v[AC_COUT2] = cout2;
      v[AC_CSTRAY1] = cstray1;
      v[AC_CSTRAY2] = cstray2;
      for (let fi = 0; fi < acFreq.length; fi++) {
        const ok = splitLoadResponseArr(v, acFreq[fi], h);
        writeAcColumns(out, acCol, fi, s, ok, h);
      }
      if (corners) {
        const ref1 = Math.abs(a11);
        const ref2 = Math.abs(a12);
        const solve = splitLoadResponseArr;
        const nc = nomCorners;
        out[corner0 + 2][s] = cornerFrequencyArr(solve, v, 1, ref1, 'high', nc[2], nc[6], h);
        out[corner0 + 3][s] = cornerFrequencyArr(solve, v, 2, ref2, 'high', nc[3], nc[7], h);
        out[corner0][s] = lowCorners ? cornerFrequencyArr(solve, v, 1, ref1, 'low', nc[0], nc[4], h) : 0;
        out[corner0 + 1][s] = lowCorners ? cornerFrequencyArr(solve, v, 2, ref2, 'low', nc[1], nc[5], h) : 0;
      }
      o_valid[s] = 1;
    }
  }

  return { inputs, metrics, nominalInputs: () => nominalArray.slice(), evaluate };
}

function writeInvalid(out: readonly Float64Array[], s: number): void {
  for (let m = 0; m < out.length; m++) out[m][s] = Number.NaN;
  out[col('valid')][s] = 0;
}
