import type { PartName, ResolvedDesign } from '../design/designSchema.js';
import { INPUTS } from '../model/stageKernel.js';
import { commonUniforms, partColumn, type TubeColumns } from './commonDraws.js';

/**
 * Kernel input columns (INPUTS order, n samples) for the design's parts at their own tolerances
 * from the seed's common draws, with the given tube envelopes. Inputs without a part hold the
 * kernel's nominal.
 *
 * @example studyColumns(design, tubeColumns(design, { kind: 'unmatched' }, 's', n), nominal, 's', n)
 */
export function studyColumns(
  design: ResolvedDesign,
  tubes: TubeColumns,
  nominal: Float64Array,
  seed: string,
  n: number,
): Float64Array[] {
  return INPUTS.map((id, i) => {
    if (id === 'perv1' || id === 'perv2' || id === 'mu1' || id === 'mu2') return tubes[id];
    const part = design.parts[id as PartName];
    if (part) return partColumn(part, part.tolerance, commonUniforms(seed, 'part', id, n), n, `parts.${id}`);
    return new Float64Array(n).fill(nominal[i]);
  });
}
