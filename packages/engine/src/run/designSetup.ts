import type { ResolvedDesign } from '../design/designSchema.js';
import { createStageKernel } from '../model/stageKernel.js';
import { preparePartSpread, type PartSpread } from '../spread/partSpread.js';
import { prepareTubeSpread } from '../spread/tubeSpread.js';
import { createSampleModel } from './createSampleModel.js';
import { createRunSetup, type RunSetup } from './runSetup.js';

type Entry = { dc: RunSetup | null; ss: RunSetup | null };
/** Designs kept, most recent last; keyed by JSON text so a worker that re-parses the same design per chunk still hits. */
const CACHE_SIZE = 8;
const cache = new Map<string, Entry>();

/**
 * The RunSetup of a design: stage kernel, part and tube spreads, specs and histogram grids.
 * Cached by the design's JSON text (the pilot costs 4096 kernel evaluations), so a worker that runs many
 * chunks of one run builds it once. `dcPerSample` false gives the small-signal-only kernel.
 * Throws RangeError naming the field for spreads the engine cannot use.
 *
 * @example designSetup(parsed.design).model.dims // ['rl1', 'rl2', ..., 'perv1', ...]
 */
export function designSetup(design: ResolvedDesign, options?: { dcPerSample?: boolean }): RunSetup {
  const dcPerSample = options?.dcPerSample ?? true;
  const key = JSON.stringify(design);
  let entry = cache.get(key);
  if (entry) cache.delete(key);
  else entry = { dc: null, ss: null };
  cache.set(key, entry);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  const hit = dcPerSample ? entry.dc : entry.ss;
  if (hit) return hit;
  const kernel = createStageKernel(design, { dcPerSample });
  const parts: Record<string, PartSpread> = {};
  for (const [name, part] of Object.entries(design.parts)) {
    if (part) parts[name] = preparePartSpread(part, `parts.${name}`);
  }
  const model = createSampleModel(kernel, parts, prepareTubeSpread(design.tube.spread, 'tube.spread'));
  const setup = createRunSetup(model, design.specs);
  if (dcPerSample) entry.dc = setup;
  else entry.ss = setup;
  return setup;
}
