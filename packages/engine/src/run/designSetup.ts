import type { ResolvedDesign } from '../design/designSchema.js';
import { createStageKernel } from '../model/stageKernel.js';
import { preparePartSpread, type PartSpread } from '../spread/partSpread.js';
import { prepareTubeSpread } from '../spread/tubeSpread.js';
import { createSampleModel } from './createSampleModel.js';
import { createRunSetup, type RunSetup } from './runSetup.js';

type Entry = Map<string, RunSetup>;
/** Kernel options a setup can be built with (see createStageKernel). */
export type DesignSetupOptions = { dcPerSample?: boolean; corners?: boolean; band?: boolean };
/** Designs kept, most recent last; keyed by JSON text so a worker that re-parses the same design per chunk still hits. */
const CACHE_SIZE = 8;
const cache = new Map<string, Entry>();

/**
 * The RunSetup of a design: stage kernel, part and tube spreads, specs and histogram grids.
 * Cached by the design's JSON text (the pilot costs 4096 kernel evaluations), so a worker that runs many
 * chunks of one run builds it once. `dcPerSample` false gives the small-signal-only kernel;
 * `corners` / `band` switch the −3 dB points and the balance band on or off (default: on when the
 * design uses the frequency analysis).
 * Throws RangeError naming the field for spreads the engine cannot use.
 *
 * @example designSetup(parsed.design).model.dims // ['rl1', 'rl2', ..., 'perv1', ...]
 */
export function designSetup(design: ResolvedDesign, options?: DesignSetupOptions): RunSetup {
  const dcPerSample = options?.dcPerSample ?? true;
  const key = JSON.stringify(design);
  let entry = cache.get(key);
  if (entry) cache.delete(key);
  else entry = new Map();
  cache.set(key, entry);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  const optionKey = `${dcPerSample}/${options?.corners}/${options?.band}`;
  const hit = entry.get(optionKey);
  if (hit) return hit;
  const kernel = createStageKernel(design, { dcPerSample, corners: options?.corners, band: options?.band });
  const parts: Record<string, PartSpread> = {};
  for (const [name, part] of Object.entries(design.parts)) {
    if (part) parts[name] = preparePartSpread(part, `parts.${name}`);
  }
  const model = createSampleModel(kernel, parts, prepareTubeSpread(design.tube.spread, 'tube.spread'));
  const setup: RunSetup = { ...createRunSetup(model, design.specs), design };
  entry.set(optionKey, setup);
  return setup;
}
