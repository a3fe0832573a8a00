import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDesign } from '../design/parseDesign.js';
import type { ResolvedDesign } from '../design/designSchema.js';
import { designSetup } from './designSetup.js';
import { assembleExtras, EXTRAS_PARTS, runExtrasPart, VARIANCE_GROUPS } from './extrasParts.js';
import type { RunPlan } from './runPlan.js';
import { setupExtras } from './setupExtras.js';

const load = (f: string): ResolvedDesign => {
  const doc: unknown = JSON.parse(readFileSync(new URL(`../../examples/${f}`, import.meta.url), 'utf8'));
  const parsed = parseDesign(doc);
  if (!parsed.ok) throw new Error(`${f} does not parse`);
  return parsed.design;
};
/** A part's value as a server worker stores and reads it back (json column). */
const viaJson = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

describe('once-per-run parts', () => {
  const designs = [load('guitar-12ax7-cap-coupled.json'), load('guitar-12au7-split-load.json')];

  it.each(designs.map((d) => [d.name, d] as const))(
    '%s: parts computed one by one, in reverse order, through JSON, assemble to the one-go extras',
    (_name, design) => {
      const setup = designSetup(design);
      const plan: RunPlan = {
        samples: 3_000,
        seed: 'parts',
        plan: 'random',
        chunkSize: 1_024,
        analyses: { largeSignal: true },
      };
      const oneGo = JSON.stringify(setupExtras(setup, plan));
      const parts = EXTRAS_PARTS.map((_p, i) => i)
        .reverse()
        .map((i) => viaJson(runExtrasPart(setup, plan, i)));
      const assembled = assembleExtras(setup, parts.reverse());
      expect(JSON.stringify(assembled)).toBe(oneGo);
      // Keys in the results' order, whatever order the parts come in.
      const keys = ['nominal', 'influence', 'varianceIndices', 'worstCase', 'largeSignal'];
      expect(Object.keys(assembled)).toEqual(keys);
      expect(assembled.varianceIndices?.dims).toEqual(setup.model.dims);
    },
  );

  it('variance indices are cut into groups that together cover every dimension once', () => {
    const setup = designSetup(designs[0]);
    const plan: RunPlan = { samples: 100, seed: 'g', plan: 'random', chunkSize: 100 };
    const groups = EXTRAS_PARTS.flatMap((p, i) =>
      p.key === 'varianceIndices' ? [runExtrasPart(setup, plan, i).value as { dims: number[] }] : [],
    );
    expect(groups).toHaveLength(VARIANCE_GROUPS);
    expect(groups.flatMap((g) => g.dims).sort((a, b) => a - b)).toEqual(setup.model.dims.map((_d, i) => i));
  });

  it('analyses switched off leave their parts null and their keys out', () => {
    const design = designs[0];
    const setup = designSetup(design);
    const plan: RunPlan = {
      samples: 100,
      seed: 'off',
      plan: 'random',
      chunkSize: 100,
      analyses: { influence: false, varianceIndices: false, worstCase: false },
    };
    const parts = EXTRAS_PARTS.map((_p, i) => runExtrasPart(setup, plan, i));
    expect(parts.filter((p) => p.value !== null).map((p) => p.key)).toEqual(['nominal']);
    expect(Object.keys(assembleExtras(setup, parts))).toEqual(['nominal']);
  });

  it('refuses a part index outside the list', () => {
    const setup = designSetup(designs[0]);
    const plan: RunPlan = { samples: 100, seed: 'x', plan: 'random', chunkSize: 100 };
    expect(() => runExtrasPart(setup, plan, EXTRAS_PARTS.length)).toThrow(RangeError);
    expect(() => runExtrasPart(setup, plan, -1)).toThrow(/part must be an integer/);
  });
});
