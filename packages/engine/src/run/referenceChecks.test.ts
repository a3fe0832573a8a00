import { describe, expect, it } from 'vitest';
import { varianceIndices } from '../influence/varianceIndices.js';
import { preparePartSpread } from '../spread/partSpread.js';
import type { SpreadSpec } from '../spread/spreadTypes.js';
import { createSampleModel } from './createSampleModel.js';
import { mergeSetupChunks } from './mergeSetupChunks.js';
import { chunkCount, type RunPlan } from './runPlan.js';
import { createRunSetup } from './runSetup.js';
import { runSetupChunk } from './runSetupChunk.js';
import { additiveKernel, ishigamiKernel } from './testKernels.js';

const noExtras = { influence: false, varianceIndices: false, worstCase: false };

/** Y = X1 + X2 + X3 + X4 with unit-sd inputs built from relative part spreads. */
function additiveRun(spread: SpreadSpec, scale: number, plan: RunPlan['plan']) {
  const parts = Object.fromEntries(
    [1, 2, 3, 4].map((i) => [`x${i}`, preparePartSpread({ value: 1, tolerance: 3, spread })]),
  );
  const setup = createRunSetup(createSampleModel(additiveKernel([scale, scale, scale, scale]), parts), []);
  const run: RunPlan = { samples: 1_000_000, seed: 'jcgm', plan, chunkSize: 65_536, analyses: noExtras };
  const chunks = Array.from({ length: chunkCount(run) }, (_v, k) => runSetupChunk(setup, run, k));
  return mergeSetupChunks(setup, run, chunks).metrics.y;
}

describe('JCGM 101:2008 (GUM Supplement 1), clause 9.2: additive model Y = X1 + X2 + X3 + X4', () => {
  it('9.2.2 Gaussian inputs (unit sd): y = 0.00, u(y) = 2.00, 95 % interval [-3.92, 3.92]', () => {
    // normal, tolerance 3 % = 3σ → σ = 1 % → (x − 1)/0.01 is standard normal.
    const y = additiveRun({ kind: 'normal' }, 0.01, 'random');
    expect(y.mean).toBeCloseTo(0, 1);
    expect(y.sd).toBeCloseTo(2, 1);
    expect(y.quantiles['p2.5']).toBeCloseTo(-3.92, 1);
    expect(y.quantiles['p97.5']).toBeCloseTo(3.92, 1);
    expect(Math.abs(y.quantiles['p97.5']! - 3.92)).toBeLessThan(0.02);
  });

  it('9.2.3 rectangular inputs (unit sd): 95 % interval [-3.88, 3.88]', () => {
    // uniform ±3 % → (x − 1)/(0.03/√3) is uniform on [−√3, √3], sd 1.
    const y = additiveRun({ kind: 'uniform' }, 0.03 / Math.sqrt(3), 'lhs');
    expect(y.sd).toBeCloseTo(2, 2);
    expect(Math.abs(y.quantiles['p2.5']! + 3.88)).toBeLessThan(0.02);
    expect(Math.abs(y.quantiles['p97.5']! - 3.88)).toBeLessThan(0.02);
    // Cross-check (analytic): Y = 2√3·(S − 2), S Irwin–Hall with 4 terms; P(S ≤ s) for 3 ≤ s ≤ 4 is
    // 1 − (4 − s)⁴/24, so the 97.5 % point is s = 4 − (0.6)^(1/4).
    expect(2 * Math.sqrt(3) * (2 - 0.6 ** 0.25)).toBeCloseTo(3.88, 2);
  });
});

describe('Ishigami function (Ishigami & Homma 1990), a = 7, b = 0.1: variance-based indices', () => {
  it('first-order and total indices within ±0.03 of the analytic values', () => {
    // Analytic: V = a²/8 + bπ⁴/5 + b²π⁸/18 + 1/2; V1 = (1 + bπ⁴/5)²/2, V2 = a²/8, V3 = 0,
    // V13 = b²π⁸(1/18 − 1/50). S1 = 0.3139, S2 = 0.4424, S3 = 0; ST1 = 0.5576, ST2 = 0.4424, ST3 = 0.2437.
    const a = 7;
    const b = 0.1;
    const pi4 = Math.PI ** 4;
    const v = (a * a) / 8 + (b * pi4) / 5 + (b * b * pi4 * pi4) / 18 + 0.5;
    const v1 = (1 + (b * pi4) / 5) ** 2 / 2;
    const v2 = (a * a) / 8;
    const v13 = b * b * pi4 * pi4 * (1 / 18 - 1 / 50);
    const uniform = preparePartSpread({ value: 1, tolerance: 50, spread: { kind: 'uniform' } });
    const model = createSampleModel(ishigamiKernel(a, b), { x1: uniform, x2: uniform, x3: uniform });
    const r = varianceIndices(model, 'ishigami', 32_768);
    const s = r.firstOrder.y as number[];
    const st = r.total.y as number[];
    expect(Math.abs(s[0] - v1 / v)).toBeLessThan(0.03);
    expect(Math.abs(s[1] - v2 / v)).toBeLessThan(0.03);
    expect(Math.abs(s[2])).toBeLessThan(0.03);
    expect(Math.abs(st[0] - (v1 + v13) / v)).toBeLessThan(0.03);
    expect(Math.abs(st[1] - v2 / v)).toBeLessThan(0.03);
    expect(Math.abs(st[2] - v13 / v)).toBeLessThan(0.03);
    expect(r.evaluations).toBe(32_768 * 5);
  });
});
