import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseDesign } from './parseDesign.js';

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
const root = new URL('../../', import.meta.url);
const examples = [
  'guitar-12ax7-cap-coupled.json',
  'hifi-6sn7-direct-coupled.json',
  'bench-12at7-loaded.json',
].map((f) => JSON.parse(readFileSync(new URL(`examples/${f}`, root), 'utf8')) as Json);

/** Odd values a hand-edited or hostile document might hold in any field. */
const oddValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(
    NaN,
    Infinity,
    -Infinity,
    1e308,
    -1e308,
    Number.MIN_VALUE,
    -0,
    2 ** 53 + 1,
    'NaN',
    'Infinity',
    '1e309',
    '',
    '4k7k',
    '0R',
    '-100k',
    '1M5%',
    '\u0000',
    '\uD800',
    '👩‍🔧'.repeat(50),
    'x'.repeat(100_000),
    null,
    true,
    [],
    {},
    { __proto__: { polluted: true } },
    Object.create(null) as object,
  ),
  fc.string({ unit: 'grapheme', maxLength: 30 }),
  fc.double(),
  fc.integer(),
  fc.jsonValue({ maxDepth: 3 }),
);

/** Every path to a value inside a JSON document. */
function paths(doc: Json, prefix: (string | number)[] = []): (string | number)[][] {
  if (doc === null || typeof doc !== 'object') return [prefix];
  const keys: (string | number)[] = Array.isArray(doc) ? doc.map((_, i) => i) : Object.keys(doc);
  return [prefix, ...keys.flatMap((k) => paths((doc as Record<string, Json>)[k as string]!, [...prefix, k]))];
}

/** The document with the value at `path` replaced (or, for the root, the value itself). */
function replaceAt(doc: Json, path: (string | number)[], value: unknown): unknown {
  if (path.length === 0) return value;
  const copy = structuredClone(doc) as Record<string, unknown>;
  let node = copy;
  for (const k of path.slice(0, -1)) node = node[k as string] as Record<string, unknown>;
  node[path[path.length - 1] as string] = value;
  return copy;
}

/** What parseDesign promises: never throws; ok with a design, or every problem with its path. */
function checkContract(input: unknown): void {
  const r = parseDesign(input);
  if (r.ok) {
    expect(typeof r.design).toBe('object');
    for (const part of Object.values(r.design.parts)) expect(Number.isFinite(part.value)).toBe(true);
  } else {
    expect(r.errors.length).toBeGreaterThan(0);
    for (const e of r.errors) {
      expect(typeof e.path).toBe('string');
      expect(e.path.length).toBeGreaterThan(0);
      expect(typeof e.message).toBe('string');
      expect(e.message.length).toBeGreaterThan(0);
    }
  }
}

describe('parseDesign under generated input', () => {
  it('the shipped examples parse', () => {
    for (const doc of examples) expect(parseDesign(doc).ok).toBe(true);
  });

  it('never throws on arbitrary JSON-like values (2,000 cases)', () => {
    fc.assert(
      fc.property(fc.oneof(oddValue, fc.anything({ maxDepth: 4 })), (input) => checkContract(input)),
      { seed: 20261203, numRuns: 2_000 },
    );
  });

  it('one odd value anywhere in a valid document: ok, or errors naming a path (3,000 cases)', () => {
    const all = examples.map((doc) => ({ doc, paths: paths(doc) }));
    fc.assert(
      fc.property(fc.nat(), fc.nat(), oddValue, (which, at, value) => {
        const { doc, paths: ps } = all[which % all.length]!;
        const path = ps[at % ps.length]!;
        const input = replaceAt(doc, path, value);
        checkContract(input);
        const r = parseDesign(input);
        // A refused odd value is reported at its own field (or one that contains it).
        if (!r.ok && path.length > 0) {
          const top = String(path[0]);
          expect(
            r.errors.some(
              (e) => e.path === '(document)' || e.path.split('.')[0] === top || top === 'version',
            ),
          ).toBe(true);
        }
      }),
      { seed: 20261204, numRuns: 3_000 },
    );
  });

  it('deeply nested and huge documents are refused, not crashed on', () => {
    let deep: unknown = 1;
    for (let i = 0; i < 10_000; i++) deep = [deep];
    checkContract(deep);
    checkContract({ ...(examples[0] as object), notes: deep });
    checkContract({
      ...(examples[0] as object),
      parts: Object.fromEntries(Array.from({ length: 5_000 }, (_, i) => [`r${i}`, {}])),
    });
  });
});
