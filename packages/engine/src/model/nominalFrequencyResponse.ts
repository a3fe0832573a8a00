import type { ResolvedDesign } from '../design/designSchema.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import {
  AC_SLOTS,
  acResponse,
  H1_IM,
  H1_RE,
  H2_IM,
  H2_RE,
  H_SLOTS,
  writeAcCircuit,
  type AcCircuit,
  type Complex,
} from './acResponse.js';
import { solveSplitLoadBiasInto } from './splitLoadBias.js';
import { splitLoadResponseArr } from './splitLoadResponse.js';
import { createStageContext, nominalStageInputs, solveStageBias } from './stageEvaluator.js';

/**
 * Plot frequencies (Hz) of the nominal response: 1 Hz to 1 MHz, 20 points per decade.
 *
 * @example
 * PLOT_FREQUENCIES.length; // 121
 */
export const PLOT_FREQUENCIES: readonly number[] = Array.from({ length: 121 }, (_, i) =>
  Number((10 ** (i / 20)).toPrecision(6)),
);

/** The nominal frequency response of a design; arrays run along `frequencies`. */
export interface FrequencyResponse {
  /** 'ok', or 'no-bias' when the design has no valid nominal bias point (arrays empty). */
  status: 'ok' | 'no-bias';
  /** Hz. */
  frequencies: number[];
  /** 20·log10|vo1/vi1| and 20·log10|vo2/vi1| (dB). */
  gain1Db: number[];
  gain2Db: number[];
  /** 20·log10(|vo2| / |vo1|) (dB). */
  balanceDb: number[];
  /** Phase of vo2 against −vo1 (degrees, (−180, 180]). */
  phaseDeg: number[];
}

/**
 * The nominal frequency response for the design editor's plot: the bias point at nominal, gm and
 * rp from the triode model there, then the complex nodal solve (capacitors, tube interelectrode
 * capacitances) at each frequency. A 'split-load' design: its one-equation bias and its own solve
 * (splitLoadResponseArr), output 1 the plate, output 2 the cathode. Pure and synchronous; a few
 * hundred microseconds for the default 121 frequencies.
 *
 * @example
 * nominalFrequencyResponse(design).balanceDb[60]; // balance at 1 kHz (dB)
 */
export function nominalFrequencyResponse(
  design: ResolvedDesign,
  frequencies: readonly number[] = PLOT_FREQUENCIES,
): FrequencyResponse {
  const empty = { frequencies: [...frequencies], gain1Db: [], gain2Db: [], balanceDb: [], phaseDeg: [] };
  const ctx = createStageContext(design);
  const x = nominalStageInputs(design);
  const splitLoad = design.topology === 'split-load';
  const status = splitLoad
    ? solveSplitLoadBiasInto({ ...ctx.bias, ...x }, ctx.bp, false)
    : solveStageBias(ctx, x, false);
  if (status !== 'ok') return { status: 'no-bias', ...empty };
  const bp = ctx.bp;
  const caps = TUBE_CATALOG[design.tube.type].capacitance;
  const circuit: AcCircuit = {
    ...{ capCoupled: ctx.ss.capCoupled, leakToGrid1: ctx.ss.leakToGrid1 },
    ...{ mu1: bp.gm1 / bp.ga1, mu2: bp.gm2 / bp.ga2, rp1: 1 / bp.ga1, rp2: 1 / bp.ga2 },
    ...{ rl1: x.rl1, rl2: x.rl2, rk: x.rk, rt: x.rt, rg1: x.rg1, rg2: x.rg2 },
    ...{ rload1: x.rload1, rload2: x.rload2, rsource: x.rsource },
    ...{ cin: x.cin, cg2: x.cg2, cout1: x.cout1, cout2: x.cout2, cstray1: x.cstray1, cstray2: x.cstray2 },
    ...{ cgk1: caps.cin, cgk2: caps.cin, cgp1: caps.cgp, cgp2: caps.cgp, cpk1: caps.cout, cpk2: caps.cout },
  };
  const out: FrequencyResponse = { status: 'ok', ...empty };
  const v = new Float64Array(AC_SLOTS);
  const h = new Float64Array(H_SLOTS);
  writeAcCircuit(circuit, v);
  const respond = (f: number): { h1: Complex; h2: Complex } => {
    if (!splitLoad) return acResponse(circuit, f);
    splitLoadResponseArr(v, f, h);
    return { h1: { re: h[H1_RE], im: h[H1_IM] }, h2: { re: h[H2_RE], im: h[H2_IM] } };
  };
  for (const f of frequencies) {
    const { h1, h2 } = respond(f);
    const m1 = h1.re * h1.re + h1.im * h1.im;
    const m2 = h2.re * h2.re + h2.im * h2.im;
    out.gain1Db.push(10 * Math.log10(m1));
    out.gain2Db.push(10 * Math.log10(m2));
    out.balanceDb.push(10 * Math.log10(m2 / m1));
    out.phaseDeg.push(
      (Math.atan2(-(h2.im * h1.re - h2.re * h1.im), -(h2.re * h1.re + h2.im * h1.im)) * 180) / Math.PI,
    );
  }
  return out;
}
