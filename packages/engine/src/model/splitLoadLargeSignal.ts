import type { ResolvedDesign } from '../design/designSchema.js';
import { TUBE_CATALOG } from '../tubes/tubeCatalog.js';
import { korenPointArr } from '../tubes/korenTriode.js';
import { createBiasPoint, type BiasCircuit } from './biasSolver.js';
import type { LargeSignalPoint, LargeSignalStage } from './largeSignal.js';
import { solveSplitLoadBiasInto } from './splitLoadBias.js';
import { nominalStageInputs, type StageInputs } from './stageEvaluator.js';

/**
 * The quasi-static large-signal model of a split-load (cathodyne) design, at nominal part values
 * or at `x` (kernel inputs: ohms, tube multipliers; section 1). No small-signal approximation: the
 * DC node equations with the triode model, the grid at its resting potential (VJ at rest, through
 * the grid leak) plus the instantaneous drive, the plate loaded by RL to B+ and by rload1 returned
 * to the plate's resting voltage, the cathode by Rb to J and by rload2 returned to the cathode's
 * resting voltage (the charged coupling capacitors), J by Rt to the tail supply and by the grid
 * leak to the driven grid (the bootstrap). Source resistance and capacitances are left out (a
 * midband signal). For a given plate current every node voltage follows linearly, and
 * F(Ia) = Ia − Ip(Va − Vk, Vg − Vk) rises with Ia, so each point is the one root of F: safeguarded
 * Newton with bisection, as the bias solver. The rest point is the bias solver's
 * (solveSplitLoadBiasInto). Points carry section 1 and the cathode (`vk`: output 2); the second
 * section's fields (va2, ia2, vgk2) are NaN.
 *
 * @example
 * const s = createSplitLoadLargeSignalStage(design);
 * s.at(1)?.vk; // the cathode with the grid one volt above rest (V)
 */
export function createSplitLoadLargeSignalStage(
  design: ResolvedDesign,
  x: StageInputs = nominalStageInputs(design),
): LargeSignalStage {
  const tube = TUBE_CATALOG[design.tube.type].model;
  const bPlus = design.supply.bPlus;
  const tail = design.supply.tail;
  const circuit: BiasCircuit = {
    ...{ capCoupled: true, bPlus, tail, vg1: 0, vg2: 0, tube },
    ...{ rl1: x.rl1, rl2: x.rl2, rk: x.rk, rt: x.rt },
    ...{ perv1: x.perv1, perv2: 1, muScale1: x.mu1, muScale2: 1 },
  };
  const bp = createBiasPoint();
  if (solveSplitLoadBiasInto(circuit, bp, false) !== 'ok') return { rest: null, at: () => null };
  const rest: LargeSignalPoint = {
    ...{ va1: bp.va1, vk: bp.vk, vj: bp.vj, ia1: bp.ia1, vgk1: bp.vgk1 },
    ...{ va2: Number.NaN, ia2: Number.NaN, vgk2: Number.NaN },
  };
  const gl = 1 / x.rl1;
  const gl1 = Number.isFinite(x.rload1) ? 1 / x.rload1 : 0;
  const gl2 = Number.isFinite(x.rload2) ? 1 / x.rload2 : 0;
  const gt = 1 / x.rt;
  const gg = Number.isFinite(x.rg1) ? 1 / x.rg1 : 0;
  const rb = x.rk;
  // Plate: Va = (B+·gL + VaRest·gl1 − Ia)/(gL + gl1), so dVa/dIa = −rpa.
  const rpa = 1 / (gl + gl1);
  // Cathode and J for a plate current ia and grid vg (2×2 linear; Rb = 0 joins them).
  const gb = rb > 0 ? 1 / rb : 0;
  const det = rb > 0 ? gb * (gg + gt) + gl2 * (gb + gg + gt) : gl2 + gg + gt;
  const rkk = rb > 0 ? (gb + gg + gt) / det : 1 / det;
  const t = new Float64Array(8);
  let warm = rest.ia1;

  const at = (vin: number): LargeSignalPoint | null => {
    const vg = rest.vj + vin;
    const nodes = (ia: number) => {
      const va = (bPlus * gl + rest.va1 * gl1 - ia) * rpa;
      const inj = ia + gl2 * rest.vk;
      const jIn = gg * vg + gt * tail;
      const vk = rb > 0 ? (inj * (gb + gg + gt) + gb * jIn) / det : (inj + jIn) / det;
      const vj = rb > 0 ? ((gb + gl2) * jIn + gb * inj) / det : vk;
      return { va, vk, vj };
    };
    const f = (ia: number) => {
      const n = nodes(ia);
      t[0] = n.va - n.vk;
      t[1] = vg - n.vk;
      t[2] = x.perv1;
      t[3] = x.mu1;
      korenPointArr(tube, t, 0);
      return ia - t[4];
    };
    // Bracket: F(0) ≤ 0; grow the upper end until F > 0 (the plate falls to its cathode).
    let lo = 0;
    let hi = Math.max(2 * rest.ia1, 1e-6);
    for (let k = 0; k < 200 && !(f(hi) > 0); k++) hi *= 2;
    if (!(f(hi) > 0)) return null;
    let ia = warm > lo && warm < hi ? warm : 0.5 * (lo + hi);
    for (let it = 0; it < 200; it++) {
      const fx = f(ia);
      if (!Number.isFinite(fx)) return null;
      if (fx > 0) hi = ia;
      else lo = ia;
      const slope = 1 + t[6] * (rpa + rkk) + t[5] * rkk;
      const d = fx / slope;
      const next = ia - d;
      if (Math.abs(d) <= 1e-13 * Math.max(ia, 1e-9) || hi - lo <= 1e-15 * hi) {
        ia = next > lo && next < hi ? next : ia;
        break;
      }
      ia = next > lo && next < hi ? next : 0.5 * (lo + hi);
    }
    warm = ia;
    const n = nodes(ia);
    t[0] = n.va - n.vk;
    t[1] = vg - n.vk;
    korenPointArr(tube, t, 0);
    return {
      ...{ va1: n.va, vk: n.vk, vj: n.vj, ia1: t[4], vgk1: vg - n.vk },
      ...{ va2: Number.NaN, ia2: Number.NaN, vgk2: Number.NaN },
    };
  };
  return { rest, at };
}
