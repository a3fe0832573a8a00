import { afterEach, describe, expect, it, vi } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { main } from './main.js';

const example = fileURLToPath(new URL('../../examples/guitar-12ax7-cap-coupled.json', import.meta.url));

function capture() {
  const out: string[] = [];
  const err: string[] = [];
  vi.spyOn(process.stdout, 'write').mockImplementation((s) => (out.push(String(s)), true));
  vi.spyOn(process.stderr, 'write').mockImplementation((s) => (err.push(String(s)), true));
  return { out, err };
}

afterEach(() => vi.restoreAllMocks());

describe('sigmatail nominal', () => {
  it('prints one JSON object with gains, DC point, warnings and trim in SI units', async () => {
    const io = capture();
    expect(await main(['nominal', example])).toBe(0);
    const r = JSON.parse(io.out.join(''));
    for (const k of [
      'a11',
      'a12',
      'a21',
      'a22',
      'zout1',
      'zout2',
      'balanceDb',
      'ia1',
      'ia2',
      'va1',
      'va2',
      'vk',
    ])
      expect(typeof r[k]).toBe('number');
    for (const k of ['gm1', 'gm2', 'rp1', 'rp2', 'mu1', 'mu2']) expect(r[k]).toBeGreaterThan(0);
    expect(r.ia1).toBeLessThan(0.01); // amperes, not milliamperes
    expect(Array.isArray(r.warnings)).toBe(true);
    expect(r.trim.e24.rl2).toBeGreaterThan(0);
    // Frequency metrics of the example's specs, −3 dB points, and the large-signal figures.
    expect(r['acBalanceDb@20000']).toBeTypeOf('number');
    expect(r.fLow1).toBeGreaterThan(0);
    expect(r.fHigh1).toBeGreaterThan(r.fLow1);
    expect(r.largeSignal.status).toBe('ok');
    expect(r.largeSignal.drive).toBeCloseTo(r.largeSignal.driveSymmetric / 2, 12);
    expect(r.largeSignal.out1.thdPercent).toBeGreaterThan(0);
    expect(r.largeSignal.swing1).toBeGreaterThan(0);
  });

  it('prints the split-load example’s frequency and large-signal figures: plate and cathode', async () => {
    const io = capture();
    const splitLoad = fileURLToPath(new URL('../../examples/guitar-12au7-split-load.json', import.meta.url));
    expect(await main(['nominal', splitLoad])).toBe(0);
    const r = JSON.parse(io.out.join(''));
    expect(r.a21).toBeNull();
    expect(r.trim).toBeNull();
    for (const k of ['fLow1', 'fLow2', 'fHigh1', 'fHigh2', 'acBalanceDb@20', 'acPhaseDeg@20000'])
      expect(r[k]).toBeTypeOf('number');
    expect(r.fHigh2).toBeGreaterThan(r.fLow2);
    expect(r.largeSignal.status).toBe('ok');
    expect(r.largeSignal.limitPositive).toBe('grid-current-1');
    expect(r.largeSignal.swing2).toBeGreaterThan(0);
    expect(r.largeSignal.out2.thdPercent).toBeGreaterThan(0);
  });

  it.each([
    ['a missing file', () => '/nonexistent/design.json', /cannot read/],
    ['bad JSON', () => file('{ "format": '), /not valid JSON/],
    ['an invalid design', () => file('{"format":"sigmatail-design","version":1}'), /invalid design .*name/],
  ])('exits 2 with a one-line message for %s', async (_n, path, message) => {
    const io = capture();
    expect(await main(['nominal', path()])).toBe(2);
    const text = io.err.join('');
    expect(text).toMatch(message);
    expect(text.trim().split('\n')).toHaveLength(1);
    expect(io.out.join('')).toBe('');
  });

  it('exits 2 without a file argument', async () => {
    const io = capture();
    expect(await main(['nominal'])).toBe(2);
    expect(io.err.join('')).toMatch(/missing design file/);
  });
});

function file(text: string): string {
  const p = join(mkdtempSync(join(tmpdir(), 'sigmatail-')), 'd.json');
  writeFileSync(p, text);
  return p;
}
