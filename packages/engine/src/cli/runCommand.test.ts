import { afterEach, describe, expect, it, vi } from 'vitest';
import { fileURLToPath } from 'node:url';
import { parseRunArgs, runCommand } from './runCommand.js';

const example = fileURLToPath(new URL('../../examples/guitar-12ax7-cap-coupled.json', import.meta.url));

describe('sigmatail run', () => {
  afterEach(() => vi.restoreAllMocks());

  it('parses the documented arguments', () => {
    expect(parseRunArgs(['d.json', '--samples', '1000', '--seed', 'abc', '--plan', 'lhs']).plan).toEqual({
      samples: 1000,
      seed: 'abc',
      plan: 'lhs',
      chunkSize: 65_536,
    });
    expect(parseRunArgs(['d.json', '--samples=5']).plan.plan).toBe('random');
    expect(parseRunArgs(['d.json', '--samples=5', '--large-signal-samples', '64']).plan.analyses).toEqual({
      largeSignal: true,
      largeSignalSamples: 64,
    });
  });

  it.each([
    [['d.json'], '--samples is required'],
    [['d.json', '--samples', '0'], '--samples must be an integer 1..100000000'],
    [['d.json', '--samples', '1e3'], '--samples must be an integer 1..100000000'],
    [['d.json', '--samples', '100000001'], '--samples must be an integer 1..100000000'],
    [['d.json', '--samples', '10', '--plan', 'grid'], '--plan must be one of random|lhs|sobol'],
    [['d.json', '--samples', '10', '--chunks', '2'], 'unknown option --chunks'],
    [['--samples', '10'], 'missing design file'],
    [
      ['d.json', '--samples', '10', '--large-signal-samples', '8'],
      '--large-signal-samples must be an integer 32..512',
    ],
    [
      ['d.json', '--samples', '10', '--large-signal-samples', '600'],
      '--large-signal-samples must be an integer 32..512',
    ],
  ])('rejects %j', (args, message) => {
    expect(() => parseRunArgs(args)).toThrow(message);
  });

  it('prints one JSON object and exits 0; bad input exits 2 with one line', async () => {
    const out: string[] = [];
    const err: string[] = [];
    vi.spyOn(process.stdout, 'write').mockImplementation((s) => (out.push(String(s)), true));
    vi.spyOn(process.stderr, 'write').mockImplementation((s) => (err.push(String(s)), true));
    expect(await runCommand([example, '--samples', '2000', '--seed', '3', '--plan', 'sobol'])).toBe(0);
    const r = JSON.parse(out.join(''));
    expect(r.samples).toBe(2000);
    expect(Object.keys(r.metrics.gainDiff.quantiles)).toEqual(['p0.135', 'p2.5', 'p50', 'p97.5', 'p99.865']);
    expect(r.metrics.gainDiff.histogram.counts.reduce((a: number, b: number) => a + b, 0)).toBeGreaterThan(0);
    expect(r.joint.wilson).toHaveLength(2);
    // 8 resistors, 6 capacitors and 4 tube inputs: more than 16 varied, so a corner search.
    expect(r.worstCase.method).toBe('search');
    // Frequency specs report their frequency and yield like any other spec.
    const bal20k = r.specs.find((s: { metric: string }) => s.metric === 'acBalanceDb');
    expect(bal20k.frequency).toBe(20000);
    expect(bal20k.yield).toBeGreaterThan(0.5);
    expect(r.metrics['acBalanceDb@20000'].count).toBe(2000);
    expect(r.influence.spearman['acBalanceDb@20000']).toBeDefined();
    expect(r.largeSignal).toBeUndefined();
    out.length = 0;
    expect(await runCommand([example, '--samples', '40', '--large-signal'])).toBe(0);
    const ls = JSON.parse(out.join('')).largeSignal;
    expect(ls.subsample).toBe(32);
    expect(ls.thd1Percent.count).toBe(32);
    expect(ls.thd1Percent.min).toBeLessThanOrEqual(ls.thd1Percent.mean);
    expect(ls.thd1Percent.interval[0]).toBeLessThan(ls.thd1Percent.mean);
    expect(await runCommand([example, '--samples', 'many'])).toBe(2);
    expect(err.join('')).toBe('sigmatail run: --samples must be an integer 1..100000000\n');
  });

  it('computes the per-sample large-signal figures of a split-load design too', async () => {
    const out: string[] = [];
    vi.spyOn(process.stdout, 'write').mockImplementation((s) => (out.push(String(s)), true));
    const splitLoad = fileURLToPath(new URL('../../examples/guitar-12au7-split-load.json', import.meta.url));
    expect(await runCommand([splitLoad, '--samples', '40', '--large-signal'])).toBe(0);
    const ls = JSON.parse(out.join('')).largeSignal;
    expect(ls.subsample).toBe(32);
    expect(ls.swing2.count).toBe(32);
    expect(ls.thd2Percent.mean).toBeGreaterThan(0);
    expect(ls.driveSymmetric.min).toBeGreaterThan(0);
  });
});
