import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { migrateDesign } from './migrateDesign.js';
import { parseDesign } from './parseDesign.js';
import { createStagePoint } from '../model/stagePoint.js';
import { METRIC_IDS } from '../model/metrics.js';
import { designSetup } from '../run/designSetup.js';
import { chunkCount } from '../run/runPlan.js';
import { mergeSetupChunks } from '../run/mergeSetupChunks.js';
import { runSetupChunk } from '../run/runSetupChunk.js';

// Version-1 documents (the engine examples and the demo seed designs as they were before format 2)
// with every midband metric the engine gave them then and the SHA-256 of a whole run's results
// (6000 Sobol samples, seed 'cmp', chunks of 2048, every analysis; engine version blanked),
// recorded from the version-1 engine.
const snapshot = JSON.parse(
  readFileSync(new URL('./version1Snapshot.json', import.meta.url), 'utf8'),
) as Record<
  string,
  { document: Record<string, unknown>; metrics: Record<string, number | string>; runSha256: string }
>;

describe('migrateDesign', () => {
  it('lifts version 1 to 2 and leaves everything else alone', () => {
    expect(migrateDesign({ format: 'sigmatail-design', version: 1, name: 'x' })).toEqual({
      format: 'sigmatail-design',
      version: 2,
      name: 'x',
    });
    const v2 = { format: 'sigmatail-design', version: 2 };
    expect(migrateDesign(v2)).toBe(v2);
    expect(migrateDesign('text')).toBe('text');
    expect(migrateDesign(null)).toBe(null);
    expect(migrateDesign({ format: 'other', version: 1 })).toEqual({ format: 'other', version: 1 });
  });

  it.each(Object.keys(snapshot))('%s (version 1) opens with every midband metric unchanged', (key) => {
    const { document, metrics } = snapshot[key];
    expect(document.version).toBe(1);
    const r = parseDesign(document);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.design.version).toBe(2);
    const now = createStagePoint(r.design)();
    for (const id of METRIC_IDS) {
      if (!(id in metrics)) continue; // metrics added with format 2
      const was = metrics[id];
      if (typeof was === 'string') expect(String(now[id])).toBe(was);
      else expect(now[id]).toBe(was);
    }
    // No capacitors in version 1: the kernel writes exactly the midband columns it wrote then.
    expect(Object.keys(now)).toEqual([...METRIC_IDS]);
  });

  it.each(Object.keys(snapshot))(
    '%s (version 1): a whole run gives the same results, byte for byte',
    (key) => {
      const r = parseDesign(snapshot[key].document);
      if (!r.ok) throw new Error('invalid');
      const setup = designSetup(r.design);
      const plan = { samples: 6000, seed: 'cmp', plan: 'sobol' as const, chunkSize: 2048 };
      const chunks = Array.from({ length: chunkCount(plan) }, (_, i) => runSetupChunk(setup, plan, i));
      const results = mergeSetupChunks(setup, plan, chunks);
      // The engine version is blanked: the numbers are what must not change.
      const text = JSON.stringify({ ...results, engineVersion: '' });
      expect(createHash('sha256').update(text).digest('hex')).toBe(snapshot[key].runSha256);
    },
  );

  it('frequency specs need a frequency, other specs refuse one', () => {
    const base = snapshot['demo/0'].document;
    const withSpecs = (specs: unknown[]) => parseDesign({ ...base, specs });
    expect(withSpecs([{ metric: 'acBalanceDb', frequency: 20e3, min: -1, max: 1 }]).ok).toBe(true);
    const missing = withSpecs([{ metric: 'acBalanceDb', min: -1 }]);
    expect(missing.ok ? [] : missing.errors.map((e) => e.path)).toEqual(['specs.0.frequency']);
    const extra = withSpecs([{ metric: 'balanceDb', frequency: 1e3, min: -1 }]);
    expect(extra.ok ? [] : extra.errors.map((e) => e.path)).toEqual(['specs.0.frequency']);
  });

  it('reads capacitor values as farads, with RKM and engineering text', () => {
    const base = snapshot['demo/0'].document as { parts: Record<string, unknown> };
    const cap = (value: unknown) => ({ value, tolerance: 10, spread: { kind: 'normal' } });
    const r = parseDesign({
      ...base,
      parts: { ...base.parts, cin: cap('22n'), cg2: cap('1u'), cout1: cap('0.1u'), cstray1: cap('4p7') },
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.design.parts.cin?.value).toBeCloseTo(22e-9, 20);
    expect(r.design.parts.cg2?.value).toBeCloseTo(1e-6, 18);
    expect(r.design.parts.cout1?.value).toBeCloseTo(1e-7, 18);
    expect(r.design.parts.cstray1?.value).toBeCloseTo(4.7e-12, 24);
    const bad = parseDesign({ ...base, parts: { ...base.parts, cin: cap('22k') } });
    expect(bad.ok ? [] : bad.errors.map((e) => e.path)).toEqual(['parts.cin.value']);
  });
});
