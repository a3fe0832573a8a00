import type { ResolvedDesign } from '../design/designSchema.js';
import { CORNER_METRIC_IDS, METRIC_IDS, METRICS, type MetricId, type MetricInfo } from './metrics.js';
import {
  AC_CG2,
  AC_CGK1,
  AC_CGK2,
  AC_CGP1,
  AC_CGP2,
  AC_CIN,
  AC_COUT1,
  AC_COUT2,
  AC_CPK1,
  AC_CPK2,
  AC_CSTRAY1,
  AC_CSTRAY2,
  AC_SLOTS,
  acResponseArr,
  pairAcSolver,
  H_SLOTS,
} from './acResponse.js';
import { cornerFrequencyArr, nominalCornerStarts } from './cornerFrequency.js';
import { acColumns, writeAcColumns, writeNominalCapacitors } from './acColumns.js';
import { createBiasPredictor } from './biasPredictor.js';
import { closedFormGainsArr } from './closedFormGains.js';
import {
  G_A11,
  G_A12,
  G_A21,
  G_A22,
  G_SLOTS,
  G_ZIN,
  G_ZOUT1,
  G_ZOUT2,
  reducedNodalGainsArr,
  SS_MU1,
  SS_MU2,
  SS_RG1,
  SS_RG2,
  SS_RK,
  SS_RL1,
  SS_RL2,
  SS_RLOAD1,
  SS_RLOAD2,
  SS_RP1,
  SS_RP2,
  SS_RSOURCE,
  SS_RT,
} from './reducedNodalGains.js';
import { createSplitLoadKernel } from './splitLoadKernel.js';
import {
  createStageContext,
  DC_MU1,
  DC_MU2,
  DC_PERV1,
  DC_PERV2,
  DC_RK,
  DC_RL1,
  DC_RL2,
  DC_RT,
  DC_SLOTS,
  nominalStageInputs,
  solveStageBias,
  solveStageBiasArr,
} from './stageEvaluator.js';

export { METRICS, METRIC_IDS, type MetricId, type MetricInfo };

/**
 * Kernel inputs in column order. mu1/mu2 multiply the section's model mu (nominal 1); perv1/perv2
 * multiply its plate-current scale (nominal 1). Resistances in ohms; absent loads are Infinity,
 * an absent source resistance is 0. Capacitors in farads; absent coupling and bypass capacitors
 * are Infinity (ideal), absent stray capacitances 0.
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
  'cin',
  'cg2',
  'cout1',
  'cout2',
  'cstray1',
  'cstray2',
] as const;

/** One of {@link INPUTS}. */
export type InputId = (typeof INPUTS)[number];

/**
 * The per-sample model Monte Carlo calls; see {@link createStageKernel}.
 *
 * @example
 * const k: StageKernel = createStageKernel(design, { dcPerSample: true });
 */
export interface StageKernel {
  /** Input columns, {@link INPUTS} order. */
  readonly inputs: readonly InputId[];
  /**
   * Output columns: {@link METRIC_IDS} in order, then the frequency columns `id@f` (see
   * acColumnId): all four frequency metrics at each spec frequency, and the balance at each
   * {@link BAND_FREQUENCIES} entry when the band is on.
   */
  readonly metrics: readonly string[];
  /** One nominal value per input. */
  nominalInputs(): Float64Array;
  /** In place, allocation-free: inputs[i][s] is input i of sample s; writes out[m][s] for s < n. */
  evaluate(inputs: readonly Float64Array[], n: number, out: readonly Float64Array[]): void;
}

// Column of each metric, as plain constants so the hot loop does no keyed lookups.
const col = (id: MetricId) => METRIC_IDS.indexOf(id);
const VALID = col('valid');
/** Relative Newton step that ends a per-sample bias solve (gm, rp good to ~1e-6; see solveBiasInto). */
const SAMPLE_STEP_TOL = 1e-6;

/**
 * Creates the stage kernel of a design. Per sample it solves the DC point (warm-started Newton
 * from the nominal solution), takes gm, rp and mu from the triode model at that bias, and solves
 * the small signal (closed form when exact, else the hand-reduced nodal solve). With
 * `dcPerSample: false` the bias is solved once at nominal; per sample only the small signal is
 * solved, with mu scaled by the mu multiplier and rp divided by the perveance multiplier
 * (a first-order approximation). A sample without a valid bias point gets valid = 0 and NaN
 * elsewhere. Then the frequency response (complex nodal solve with the capacitors): the four
 * frequency metrics at each spec frequency, and, when the design uses the frequency analysis
 * (see usesFrequencyAnalysis; `corners` / `band` override), the −3 dB points (secant from the
 * nominal corners) and the balance at each BAND_FREQUENCIES entry.
 * A 'split-load' design gets its sibling kernel (createSplitLoadKernel): same inputs, metric ids
 * and frequency columns, with its own DC, small-signal and frequency-response solves.
 *
 * @example
 * const k = createStageKernel(design);
 * const inputs = k.inputs.map((_, i) => new Float64Array(n).fill(k.nominalInputs()[i]));
 * const out = k.metrics.map(() => new Float64Array(n));
 * k.evaluate(inputs, n, out); // out[METRIC_IDS.indexOf('balanceDb')][s] in dB
 */
export function createStageKernel(
  design: ResolvedDesign,
  options?: { dcPerSample?: boolean; corners?: boolean; band?: boolean },
): StageKernel {
  const dcPerSample = options?.dcPerSample ?? true;
  const analysis = usesFrequencyAnalysis(design);
  const corners = options?.corners ?? analysis;
  const cornerIds: readonly string[] = corners ? CORNER_METRIC_IDS : [];
  const ac = acColumns(design, options?.band ?? analysis, METRIC_IDS.length + cornerIds.length);
  const metrics: readonly string[] = [...METRIC_IDS, ...cornerIds, ...ac.ids];
  if (design.topology === 'split-load')
    return createSplitLoadKernel(design, INPUTS, metrics, { dcPerSample, corners, ac });
  const ctx = createStageContext(design);
  const nominal = nominalStageInputs(design);
  const nominalArray = Float64Array.from(INPUTS.map((id) => nominal[id]));
  const predictor = createBiasPredictor(ctx, nominal);
  solveStageBias(ctx, nominal, false);
  const nb = { ...ctx.bp };
  const nominalValid = nb.status === 'ok';
  const heater = ctx.heater;
  // Per-sample scratch: DC inputs, small-signal circuit, gains (see the *Arr solvers).
  const dcv = new Float64Array(DC_SLOTS);
  const v = new Float64Array(AC_SLOTS);
  const g = new Float64Array(G_SLOTS);
  const h = new Float64Array(H_SLOTS);
  // Tube interelectrode capacitances (catalog, per section; no spread).
  const caps = ctx.tube.capacitance;
  v[AC_CGK1] = caps.cin;
  v[AC_CGK2] = caps.cin;
  v[AC_CGP1] = caps.cgp;
  v[AC_CGP2] = caps.cgp;
  v[AC_CPK1] = caps.cout;
  v[AC_CPK2] = caps.cout;
  // Nominal −3 dB points: the per-sample corner searches start from them.
  const nomCorners = nominalCorners(ctx, nominal, nb, v, h, corners);
  const lowCorners =
    corners &&
    !(
      nominal.cin === Number.POSITIVE_INFINITY &&
      nominal.cg2 === Number.POSITIVE_INFINITY &&
      nominal.cout1 === Number.POSITIVE_INFINITY &&
      nominal.cout2 === Number.POSITIVE_INFINITY
    );
  const acFreq = ac.frequencies;
  const acCol = ac.columns;

  // Slot numbers as locals: an imported binding can cost a getter call per use (transpiled
  // modules), which the per-sample loop must not pay.
  const g_a11 = G_A11;
  const g_a12 = G_A12;
  const g_a21 = G_A21;
  const g_a22 = G_A22;
  const g_zin = G_ZIN;
  const g_zout1 = G_ZOUT1;
  const g_zout2 = G_ZOUT2;
  const ss_mu1 = SS_MU1;
  const ss_mu2 = SS_MU2;
  const ss_rg1 = SS_RG1;
  const ss_rg2 = SS_RG2;
  const ss_rk = SS_RK;
  const ss_rl1 = SS_RL1;
  const ss_rl2 = SS_RL2;
  const ss_rload1 = SS_RLOAD1;
  const ss_rload2 = SS_RLOAD2;
  const ss_rp1 = SS_RP1;
  const ss_rp2 = SS_RP2;
  const ss_rsource = SS_RSOURCE;
  const ss_rt = SS_RT;
  const dc_mu1 = DC_MU1;
  const dc_mu2 = DC_MU2;
  const dc_perv1 = DC_PERV1;
  const dc_perv2 = DC_PERV2;
  const dc_rk = DC_RK;
  const dc_rl1 = DC_RL1;
  const dc_rl2 = DC_RL2;
  const dc_rt = DC_RT;
  // The per-sample calls, bound once for the same reason.
  const nodalGains = reducedNodalGainsArr;
  const closedGains = closedFormGainsArr;
  const solveBias = solveStageBiasArr;
  const acResponse = acResponseArr;
  const corner = cornerFrequencyArr;
  const solve = pairAcSolver(ctx.ss.capCoupled, ctx.ss.leakToGrid1);

  function evaluate(inputs: readonly Float64Array[], n: number, out: readonly Float64Array[]): void {
    const bp = ctx.bp;
    const i_rl1 = inputs[0];
    const i_rl2 = inputs[1];
    const i_rk = inputs[2];
    const i_rt = inputs[3];
    const i_rg1 = inputs[4];
    const i_rg2 = inputs[5];
    const i_rload1 = inputs[6];
    const i_rload2 = inputs[7];
    const i_rsource = inputs[8];
    const i_mu1 = inputs[9];
    const i_mu2 = inputs[10];
    const i_perv1 = inputs[11];
    const i_perv2 = inputs[12];
    const i_cin = inputs[13];
    const i_cg2 = inputs[14];
    const i_cout1 = inputs[15];
    const i_cout2 = inputs[16];
    const i_cstray1 = inputs[17];
    const i_cstray2 = inputs[18];
    // Corner columns follow METRIC_IDS when on (unused otherwise).
    const o_fLow1 = out[corners ? METRIC_IDS.length : 0];
    const o_fLow2 = out[corners ? METRIC_IDS.length + 1 : 0];
    const o_fHigh1 = out[corners ? METRIC_IDS.length + 2 : 0];
    const o_fHigh2 = out[corners ? METRIC_IDS.length + 3 : 0];
    const nf = acFreq.length;
    const o_a11 = out[col('a11')];
    const o_a12 = out[col('a12')];
    const o_a21 = out[col('a21')];
    const o_a22 = out[col('a22')];
    const o_gainDiff = out[col('gainDiff')];
    const o_balanceDb = out[col('balanceDb')];
    const o_zout1 = out[col('zout1')];
    const o_zout2 = out[col('zout2')];
    const o_zin = out[col('zin')];
    const o_gainDm = out[col('gainDm')];
    const o_gainCm = out[col('gainCm')];
    const o_cmrrDb = out[col('cmrrDb')];
    const o_ia1 = out[col('ia1')];
    const o_ia2 = out[col('ia2')];
    const o_va1 = out[col('va1')];
    const o_va2 = out[col('va2')];
    const o_vk = out[col('vk')];
    const o_vgk1 = out[col('vgk1')];
    const o_vgk2 = out[col('vgk2')];
    const o_pd1 = out[col('pd1')];
    const o_pd2 = out[col('pd2')];
    const o_vhk = out[col('vhk')];
    const o_gm1 = out[col('gm1')];
    const o_gm2 = out[col('gm2')];
    const o_rp1 = out[col('rp1')];
    const o_rp2 = out[col('rp2')];
    const o_mu1 = out[col('mu1')];
    const o_mu2 = out[col('mu2')];
    const o_valid = out[col('valid')];
    const closedForm = ctx.closedForm;
    const capCoupled = ctx.ss.capCoupled;
    const leakToGrid1 = ctx.ss.leakToGrid1;
    for (let s = 0; s < n; s++) {
      // Inputs go to locals and Float64Array scratch only: doubles written to object fields or
      // passed to non-inlined calls would be boxed (a heap number each) per sample.
      const rl1 = i_rl1[s];
      const rl2 = i_rl2[s];
      const rk = i_rk[s];
      const rt = i_rt[s];
      const rg1 = i_rg1[s];
      const rg2 = i_rg2[s];
      const rload1 = i_rload1[s];
      const rload2 = i_rload2[s];
      const rsource = i_rsource[s];
      const xmu1 = i_mu1[s];
      const xmu2 = i_mu2[s];
      const perv1 = i_perv1[s];
      const perv2 = i_perv2[s];
      // Small-signal-only parts must be usable too (Infinity is fine for the loads).
      const cin = i_cin[s];
      const cg2 = i_cg2[s];
      const cout1 = i_cout1[s];
      const cout2 = i_cout2[s];
      const cstray1 = i_cstray1[s];
      const cstray2 = i_cstray2[s];
      if (
        !(rg1 > 0 && rg2 > 0 && rload1 > 0 && rload2 > 0 && rsource >= 0) ||
        !(cin > 0 && cg2 > 0 && cout1 > 0 && cout2 > 0 && cstray1 >= 0 && cstray2 >= 0)
      ) {
        writeInvalid(out, s);
        continue;
      }
      let gm1: number, gm2: number, rp1: number, rp2: number;
      if (dcPerSample) {
        dcv[dc_rl1] = rl1;
        dcv[dc_rl2] = rl2;
        dcv[dc_rk] = rk;
        dcv[dc_rt] = rt;
        dcv[dc_perv1] = perv1;
        dcv[dc_perv2] = perv2;
        dcv[dc_mu1] = xmu1;
        dcv[dc_mu2] = xmu2;
        predictor.predictArr(dcv);
        if (solveBias(ctx, dcv, nominalValid, SAMPLE_STEP_TOL) !== 'ok') {
          writeInvalid(out, s);
          continue;
        }
        gm1 = bp.gm1;
        gm2 = bp.gm2;
        rp1 = 1 / bp.ga1;
        rp2 = 1 / bp.ga2;
      } else {
        if (!nominalValid || !(rl1 > 0 && rl2 > 0 && rk >= 0 && rt > 0 && perv1 > 0 && perv2 > 0)) {
          writeInvalid(out, s);
          continue;
        }
        rp1 = 1 / (nb.ga1 * perv1);
        rp2 = 1 / (nb.ga2 * perv2);
        gm1 = ((nb.gm1 / nb.ga1) * xmu1) / rp1;
        gm2 = ((nb.gm2 / nb.ga2) * xmu2) / rp2;
      }
      const src = dcPerSample ? bp : nb;
      const mu1 = gm1 * rp1;
      const mu2 = gm2 * rp2;
      v[ss_mu1] = mu1;
      v[ss_mu2] = mu2;
      v[ss_rp1] = rp1;
      v[ss_rp2] = rp2;
      v[ss_rl1] = rl1;
      v[ss_rl2] = rl2;
      v[ss_rk] = rk;
      v[ss_rt] = rt;
      v[ss_rg1] = rg1;
      v[ss_rg2] = rg2;
      v[ss_rload1] = rload1;
      v[ss_rload2] = rload2;
      v[ss_rsource] = rsource;
      if (closedForm) closedGains(v, g);
      else nodalGains(capCoupled, leakToGrid1, v, g);
      const a11 = g[g_a11];
      const a12 = g[g_a12];
      const a21 = g[g_a21];
      const a22 = g[g_a22];
      o_a11[s] = a11;
      o_a12[s] = a12;
      o_a21[s] = a21;
      o_a22[s] = a22;
      o_gainDiff[s] = a11 - a12;
      o_balanceDb[s] = 20 * Math.log10(Math.abs(a12) / Math.abs(a11));
      o_zout1[s] = g[g_zout1];
      o_zout2[s] = g[g_zout2];
      o_zin[s] = g[g_zin];
      const dm = 0.5 * (a11 - a12 - a21 + a22);
      const cm = 0.5 * (a11 + a12 + a21 + a22);
      o_gainDm[s] = dm;
      o_gainCm[s] = cm;
      o_cmrrDb[s] = 20 * Math.log10(Math.abs(dm) / Math.abs(cm));
      const ia1 = src.ia1;
      const ia2 = src.ia2;
      const va1 = src.va1;
      const va2 = src.va2;
      const vk = src.vk;
      o_ia1[s] = ia1;
      o_ia2[s] = ia2;
      o_va1[s] = va1;
      o_va2[s] = va2;
      o_vk[s] = vk;
      o_vgk1[s] = src.vgk1;
      o_vgk2[s] = src.vgk2;
      o_pd1[s] = ia1 * (va1 - vk);
      o_pd2[s] = ia2 * (va2 - vk);
      o_vhk[s] = vk - heater;
      o_gm1[s] = gm1;
      o_gm2[s] = gm2;
      o_rp1[s] = rp1;
      o_rp2[s] = rp2;
      o_mu1[s] = mu1;
      o_mu2[s] = mu2;
      // Frequency response: the capacitors join the small-signal circuit already in v.
      v[AC_CIN] = cin;
      v[AC_CG2] = cg2;
      v[AC_COUT1] = cout1;
      v[AC_COUT2] = cout2;
      v[AC_CSTRAY1] = cstray1;
      v[AC_CSTRAY2] = cstray2;
      for (let fi = 0; fi < nf; fi++) {
        const ok = acResponse(capCoupled, leakToGrid1, v, acFreq[fi], h);
        writeAcColumns(out, acCol, fi, s, ok, h);
      }
      if (corners) {
        const ref1 = Math.abs(a11);
        const ref2 = Math.abs(a12);
        o_fHigh1[s] = corner(solve, v, 1, ref1, 'high', nomCorners[2], nomCorners[6], h);
        o_fHigh2[s] = corner(solve, v, 2, ref2, 'high', nomCorners[3], nomCorners[7], h);
        if (lowCorners) {
          o_fLow1[s] = corner(solve, v, 1, ref1, 'low', nomCorners[0], nomCorners[4], h);
          o_fLow2[s] = corner(solve, v, 2, ref2, 'low', nomCorners[1], nomCorners[5], h);
        } else {
          o_fLow1[s] = 0;
          o_fLow2[s] = 0;
        }
      }
      o_valid[s] = 1;
    }
  }

  return {
    inputs: INPUTS,
    metrics,
    nominalInputs: () => nominalArray.slice(),
    evaluate,
  };
}

/**
 * Whether a design uses the frequency analysis (−3 dB points and the balance band): it has a
 * capacitor part or a spec on a frequency metric. Without, the kernel writes only the midband
 * columns, exactly as before capacitors existed.
 *
 * @example
 * usesFrequencyAnalysis(buildDesign()); // false
 */
export function usesFrequencyAnalysis(design: ResolvedDesign): boolean {
  const p = design.parts;
  const caps = p.cin ?? p.cg2 ?? p.cout1 ?? p.cout2 ?? p.cstray1 ?? p.cstray2;
  const corner = (CORNER_METRIC_IDS as readonly string[]).includes.bind(CORNER_METRIC_IDS);
  return caps !== undefined || design.specs.some((s) => s.frequency !== undefined || corner(s.metric));
}

/**
 * Nominal −3 dB points and slopes (see nominalCornerStarts); fills v with the nominal circuit.
 */
function nominalCorners(
  ctx: ReturnType<typeof createStageContext>,
  x: ReturnType<typeof nominalStageInputs>,
  nb: { status: string; gm1: number; gm2: number; ga1: number; ga2: number },
  v: Float64Array,
  h: Float64Array,
  on: boolean,
): Float64Array {
  if (!on || nb.status !== 'ok') return Float64Array.of(1e3, 1e3, 1e3, 1e3, 0, 0, 0, 0);
  v[SS_RP1] = 1 / nb.ga1;
  v[SS_RP2] = 1 / nb.ga2;
  v[SS_MU1] = nb.gm1 / nb.ga1;
  v[SS_MU2] = nb.gm2 / nb.ga2;
  v[SS_RL1] = x.rl1;
  v[SS_RL2] = x.rl2;
  v[SS_RK] = x.rk;
  v[SS_RT] = x.rt;
  v[SS_RG1] = x.rg1;
  v[SS_RG2] = x.rg2;
  v[SS_RLOAD1] = x.rload1;
  v[SS_RLOAD2] = x.rload2;
  v[SS_RSOURCE] = x.rsource;
  writeNominalCapacitors(x, v);
  const g = new Float64Array(G_SLOTS);
  reducedNodalGainsArr(ctx.ss.capCoupled, ctx.ss.leakToGrid1, v, g);
  const solve = pairAcSolver(ctx.ss.capCoupled, ctx.ss.leakToGrid1);
  return nominalCornerStarts(solve, v, Math.abs(g[G_A11]), Math.abs(g[G_A12]), h);
}

function writeInvalid(out: readonly Float64Array[], s: number): void {
  for (let m = 0; m < out.length; m++) out[m][s] = Number.NaN;
  out[VALID][s] = 0;
}
