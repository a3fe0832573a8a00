import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseDesign } from '../design/parseDesign.js';
import type { ResolvedDesign } from '../design/designSchema.js';
import { largeSignalReport } from '../model/largeSignalReport.js';
import { designSetup } from './designSetup.js';
import { LARGE_SIGNAL_SUBSAMPLE } from './largeSignalSpread.js';
import { mergeChunks, runChunk, runExtras } from './runApi.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import { setupExtras } from './setupExtras.js';

const load = (file: string): ResolvedDesign => {
  const r = parseDesign(JSON.parse(readFileSync(new URL(`../../examples/${file}`, import.meta.url), 'utf8')));
  if (!r.ok) throw new Error(file);
  return r.design;
};
const guitar = load('guitar-12ax7-cap-coupled.json');
const plan: RunPlan = {
  samples: 200,
  seed: 'ls',
  plan: 'random',
  chunkSize: 64,
  analyses: { influence: false, varianceIndices: false, worstCase: false, largeSignal: true },
};

describe('per-sample large-signal figures in the once-per-run extras', () => {
  const ls = runExtras(guitar, plan).largeSignal!;

  it('are computed on the first 32 samples at the nominal half-limit drive', () => {
    expect(ls.subsample).toBe(LARGE_SIGNAL_SUBSAMPLE);
    expect(ls.drive).toBe(largeSignalReport(guitar).drive);
    for (const s of [ls.swing1, ls.swing2, ls.thd1Percent, ls.thd2Percent, ls.h2Percent2!, ls.h3Percent2!]) {
      expect(s.count).toBe(32);
      expect(s.min!).toBeLessThanOrEqual(s.mean!);
      expect(s.mean!).toBeLessThanOrEqual(s.max!);
      expect(s.interval![0]).toBeLessThanOrEqual(s.mean!);
    }
  });

  it('are off by default, computed for split-load too, and the same whichever entry point computes them', () => {
    const { analyses: _, ...plain } = plan;
    expect(runExtras(guitar, plain).largeSignal).toBeUndefined();
    const splitLoad = runExtras(load('guitar-12au7-split-load.json'), plan).largeSignal!;
    expect(splitLoad.subsample).toBe(32);
    expect(splitLoad.swing2.count).toBe(32);
    expect(splitLoad.thd2Percent.mean!).toBeGreaterThan(0);
    expect(setupExtras(designSetup(guitar), plan).largeSignal).toEqual(ls);
    const chunks = Array.from({ length: chunkCount(plan) }, (_, k) => runChunk(guitar, plan, k));
    expect(mergeChunks(guitar, plan, chunks).largeSignal).toEqual(ls);
  });

  it('take a larger subsample when the plan asks, and refuse one out of bounds naming the field', () => {
    const more = { ...plan, analyses: { ...plan.analyses, largeSignalSamples: 40 } };
    const wider = runExtras(guitar, more).largeSignal!;
    expect(wider.subsample).toBe(40);
    expect(wider.swing1.count).toBe(40);
    // The first 32 samples are the same ones: the figures of the default subsample lie within.
    expect(wider.swing1.min!).toBeLessThanOrEqual(ls.swing1.min!);
    expect(wider.swing1.max!).toBeGreaterThanOrEqual(ls.swing1.max!);
    expect(() => runExtras(guitar, { ...plan, analyses: { largeSignalSamples: 513 } })).toThrow(
      'analyses.largeSignalSamples must be an integer 32..512',
    );
    expect(() => chunkCount({ ...plan, analyses: { largeSignalSamples: 31.5 } })).toThrow(
      /largeSignalSamples/,
    );
  });

  it('vary from sample to sample (each sample at its own parts and tubes)', () => {
    expect(ls.swing1.max!).toBeGreaterThan(ls.swing1.min!);
    expect(ls.thd1Percent.max!).toBeGreaterThan(ls.thd1Percent.min!);
  });
});
