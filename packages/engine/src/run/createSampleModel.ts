import { applyPartSpreadInPlace, partQuantile, partRange, type PartSpread } from '../spread/partSpread.js';
import { normalQuantile } from '../spread/normalQuantile.js';
import { quantileSorted } from '../lots/summarizeLot.js';
import {
  fillTubeFromLotInPlace,
  fillTubeInPlace,
  tubeRange,
  type TubeSpreadModel,
} from '../spread/tubeSpread.js';
import type { InputRange, Kernel, SampleModel } from './sampleModel.js';

/** A column of one-halves, grown as needed. */
let halves = new Float64Array(0);
function halfColumn(n: number): Float64Array {
  if (halves.length < n) halves = new Float64Array(n).fill(0.5);
  return halves;
}

/** Kernel input names the tube spread writes (section multipliers). */
const TUBE_INPUTS = ['perv1', 'perv2', 'mu1', 'mu2'] as const;

/**
 * Builds a SampleModel: each varied part (keyed by kernel input name) gets one draw dimension;
 * a tube spread, if given, gets one dimension per section and quantity with a non-zero spread
 * (perv1, perv2 noise, mu1, mu2 noise) and writes the kernel inputs perv1, perv2, mu1, mu2.
 * Inputs without a spread stay at the kernel's nominal.
 *
 * @example createSampleModel(kernel, { x1: preparePartSpread({ value: 0, ... }) })
 */
export function createSampleModel(
  kernel: Kernel,
  parts: Readonly<Record<string, PartSpread>>,
  tube: TubeSpreadModel | null = null,
): SampleModel {
  const nominal = kernel.nominalInputs();
  const indexOf = (name: string): number => {
    const i = kernel.inputs.indexOf(name);
    if (i < 0) throw new RangeError(`kernel has no input '${name}'`);
    return i;
  };
  const dims: string[] = [];
  const partDims: { input: number; dim: number; spread: PartSpread }[] = [];
  const ranges: InputRange[] = kernel.inputs.map((input, i) => ({
    input,
    nominal: nominal[i],
    low: nominal[i],
    high: nominal[i],
    varied: false,
  }));
  for (const [name, spread] of Object.entries(parts)) {
    const input = indexOf(name);
    ranges[input] = { input: name, nominal: spread.nominal, ...partRange(spread), varied: spread.varied };
    if (!spread.varied) continue;
    partDims.push({ input, dim: dims.length, spread });
    dims.push(name);
  }
  const tubeIdx = tube ? TUBE_INPUTS.map(indexOf) : [];
  const tubeDim = { perv1: -1, perv2: -1, mu1: -1, mu2: -1 };
  // A measured lot: one draw dimension picks a whole tube (both sections together).
  let lotDim = -1;
  if (tube?.lot) {
    const sorted = tube.lot.sorted;
    TUBE_INPUTS.forEach((name, c) => {
      const col = sorted[c];
      const i = indexOf(name);
      ranges[i] = {
        input: name,
        nominal: 1,
        low: col[0],
        high: col[col.length - 1],
        varied: col[0] !== col[col.length - 1],
      };
    });
    if (tube.lot.count > 1) {
      lotDim = dims.length;
      dims.push('tube');
    }
  } else if (tube) {
    for (const name of TUBE_INPUTS) {
      const s = name.startsWith('perv') ? tube.sPerv : tube.sMu;
      const i = indexOf(name);
      ranges[i] = { input: name, nominal: 1, ...tubeRange(s), varied: s > 0 };
      if (s > 0) {
        tubeDim[name] = dims.length;
        dims.push(name);
      }
    }
  }
  // Inputs without a draw hold one value: the kernel nominal, or a constant part's only value.
  const base = Float64Array.from(nominal);
  for (const [name, spread] of Object.entries(parts))
    if (!spread.varied) base[indexOf(name)] = partQuantile(spread, 0.5);
  const fixedInputs = ranges
    .map((_r, i) => i)
    .filter((i) => !partDims.some((p) => p.input === i) && !tubeIdx.includes(i));

  return {
    kernel,
    dims,
    ranges,
    fillInputs(u, n, inputs, redraw, tally) {
      for (const p of partDims) applyPartSpreadInPlace(p.spread, u[p.dim], inputs[p.input], n);
      for (const i of fixedInputs) inputs[i].fill(base[i], 0, n);
      if (tube?.lot) {
        const out = {
          perv1: inputs[tubeIdx[0]],
          perv2: inputs[tubeIdx[1]],
          mu1: inputs[tubeIdx[2]],
          mu2: inputs[tubeIdx[3]],
        };
        // A one-tube lot has no draw dimension: every sample gets that tube (u = 0.5).
        fillTubeFromLotInPlace(tube, lotDim >= 0 ? u[lotDim] : halfColumn(n), n, out, redraw, tally);
      } else if (tube) {
        const col = (d: number) => (d >= 0 ? u[d] : null);
        fillTubeInPlace(
          tube,
          {
            perv1: col(tubeDim.perv1),
            perv2: col(tubeDim.perv2),
            mu1: col(tubeDim.mu1),
            mu2: col(tubeDim.mu2),
          },
          n,
          {
            perv1: inputs[tubeIdx[0]],
            perv2: inputs[tubeIdx[1]],
            mu1: inputs[tubeIdx[2]],
            mu2: inputs[tubeIdx[3]],
          },
          redraw,
          tally,
        );
      }
    },
    inputQuantile(input, p) {
      const part = partDims.find((d) => d.input === input);
      if (part) return partQuantile(part.spread, p);
      const t = tubeIdx.indexOf(input);
      if (tube?.lot && t >= 0) return quantileSorted(tube.lot.sorted[t], p);
      if (tube && t >= 0) return Math.exp((t < 2 ? tube.sPerv : tube.sMu) * normalQuantile(p));
      return base[input];
    },
  };
}
