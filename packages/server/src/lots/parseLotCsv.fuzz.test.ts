import { LOT_COLUMNS, MAX_LOT_ROW_ERRORS, MAX_LOT_ROWS, TUBE_CATALOG, TUBE_TYPES } from '@sigmatail/engine';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseLotCsv, type LotFileSpec, type ParsedLot } from './parseLotCsv.js';

// Property-based fuzzing of the lot CSV parser with resistor lots and tube lots (ia-gm and mu-rp):
// random bytes and unicode, wrong, missing and duplicate headers, extra columns, empty rows,
// quoted fields with embedded newlines and commas, huge numbers, NaN/Infinity/-0/1e309, RKM codes
// valid and invalid, negative values, BOM, CRLF, semicolons and very long lines. Expected: the
// parser never throws; it answers either ok, with only finite positive values and as many as there
// are data rows, or refused, with row-level errors that each name a row, a column ('' = the whole
// row) and a reason. Metamorphic: a lot read with CRLF line ends or a BOM reads as with LF.

const specArb: fc.Arbitrary<LotFileSpec> = fc.oneof(
  fc.constant<LotFileSpec>({ kind: 'resistor' }),
  fc
    .record({
      quantity: fc.constantFrom('ia-gm' as const, 'mu-rp' as const),
      tubeType: fc.constantFrom(...TUBE_TYPES),
    })
    .map(({ quantity, tubeType }) => ({
      kind: 'tube' as const,
      quantity,
      tubeType,
      testPoint: { va: TUBE_CATALOG[tubeType].typical.va, vg: TUBE_CATALOG[tubeType].typical.vg },
    })),
);

const columnsOf = (spec: LotFileSpec): readonly string[] =>
  spec.kind === 'resistor' ? LOT_COLUMNS.resistor : LOT_COLUMNS[spec.quantity];

const ODD_CELLS = [
  '',
  ' ',
  'NaN',
  'Infinity',
  '-Infinity',
  '-0',
  '0',
  '1e309',
  '-1e309',
  '1e-320',
  '1e308',
  '1.7e308',
  '1e-310',
  '1e-300',
  '1e300',
  '9'.repeat(400),
  '-470',
  '4k7',
  '4K7',
  '4k7k',
  'k47',
  '0R',
  'R47',
  '1M5',
  '4x7',
  '470 Ω',
  '2.2k',
  '1,5',
  '0x1F',
  'null',
  '💥',
  '\u0000',
  '\uFEFF470',
  'line\nbreak',
  'a "quoted" word',
  'x'.repeat(100_000),
];

/** A cell that may be good for some column (a positive number) or anything odd. */
const cellArb = fc.oneof(
  { weight: 4, arbitrary: fc.double({ min: 1e-3, max: 1e6, noNaN: true }).map((v) => String(v)) },
  { weight: 1, arbitrary: fc.double().map((v) => String(v)) },
  { weight: 3, arbitrary: fc.constantFrom(...ODD_CELLS) },
  { weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 8 }) },
  {
    weight: 1,
    arbitrary: fc
      .tuple(fc.nat(999), fc.constantFrom('R', 'r', 'k', 'K', 'M', 'G', 'm', 'x', 'µ'), fc.nat(99))
      .map(([a, l, b]) => `${a || ''}${l}${b || ''}`),
  },
);

/** A header: the right columns shuffled, padded or upper-cased, with extras, a gap or a duplicate. */
function headerArb(spec: LotFileSpec): fc.Arbitrary<string[]> {
  const cols = columnsOf(spec);
  return fc
    .record({
      order: fc.shuffledSubarray([...cols], { minLength: 0, maxLength: cols.length }),
      extras: fc.array(fc.constantFrom('serial', 'note', 'value', 'ia1', 'rp2', '', 'VALUE ', 'µ'), {
        maxLength: 3,
      }),
      dup: fc.boolean(),
      shout: fc.boolean(),
      junk: fc.option(fc.string({ unit: 'grapheme', maxLength: 10 }), { freq: 5 }),
    })
    .map(({ order, extras, dup, shout, junk }) => {
      const h = [...order, ...extras];
      if (dup && order.length > 0) h.push(order[0]!);
      if (junk !== null) h.push(junk);
      return h.map((c) => (shout ? ` ${c.toUpperCase()} ` : c));
    });
}

interface Lot {
  spec: LotFileSpec;
  header: string[];
  rows: string[][];
  /** Indices before which a blank line is put. */
  blanks: number[];
}

function lotArb(spec: LotFileSpec, cell: fc.Arbitrary<string>): fc.Arbitrary<Lot> {
  return fc.record({
    spec: fc.constant(spec),
    header: headerArb(spec),
    rows: fc.array(fc.array(cell, { minLength: 1, maxLength: 6 }), { maxLength: 25 }),
    blanks: fc.array(fc.nat(25), { maxLength: 3 }),
  });
}

/** Writes a lot: quotes cells that need it (or at random), with a delimiter, line end and BOM. */
function writeCsv(
  lot: Lot,
  o: { delimiter: string; eol: string; bom: boolean; quoteAll: boolean },
): { text: string; dataRows: number } {
  const q = (c: string) =>
    o.quoteAll || /[",;\r\n]/.test(c) || c !== c.trim() ? `"${c.replace(/"/g, '""')}"` : c;
  const lines = [lot.header.map(q).join(o.delimiter)];
  let dataRows = 0;
  lot.rows.forEach((r, i) => {
    if (lot.blanks.includes(i)) lines.push('');
    const line = r.map(q).join(o.delimiter);
    // An all-blank line is skipped by design; any other line is a data row.
    if (line.trim() !== '') dataRows++;
    lines.push(line);
  });
  return { text: (o.bom ? '\uFEFF' : '') + lines.join(o.eol) + o.eol, dataRows };
}

const formatArb = fc.record({
  delimiter: fc.constantFrom(',', ',', ',', ';', '\t'),
  eol: fc.constantFrom('\n', '\r\n', '\r'),
  bom: fc.boolean(),
  quoteAll: fc.boolean(),
});

/** What parseLotCsv promises for any input. `dataRows`, when known, is what an ok count must be. */
function checkContract(r: ParsedLot, spec: LotFileSpec, dataRows?: number): void {
  const cols = columnsOf(spec);
  if (r.ok) {
    if (dataRows !== undefined) expect(r.count).toBe(dataRows);
    expect(r.count).toBeGreaterThan(0);
    expect(r.count).toBeLessThanOrEqual(MAX_LOT_ROWS);
    const positive = (v: number) => Number.isFinite(v) && v > 0;
    if (spec.kind === 'resistor') {
      const { values } = r.data as { values: number[] };
      expect(values).toHaveLength(r.count);
      expect(values.every(positive), `values ${values.join(' ')}`).toBe(true);
    } else {
      const { sections, multipliers } = r.data as { sections: number[][]; multipliers: number[][] };
      expect(sections).toHaveLength(r.count);
      expect(multipliers).toHaveLength(r.count);
      for (const row of [...sections, ...multipliers]) {
        expect(row).toHaveLength(4);
        expect(row.every(positive), `row ${row.join(' ')}`).toBe(true);
      }
    }
  } else {
    expect(r.errors.length).toBeGreaterThan(0);
    expect(r.errors.length).toBeLessThanOrEqual(MAX_LOT_ROW_ERRORS);
    expect(r.errorCount).toBeGreaterThanOrEqual(r.errors.length);
    expect(r.message).toMatch(/nothing was stored/);
    for (const e of r.errors) {
      expect(Number.isInteger(e.row) && e.row >= 1, `row ${e.row}`).toBe(true);
      expect(['', ...cols]).toContain(e.column);
      expect(typeof e.message === 'string' && e.message.length > 0).toBe(true);
    }
  }
}

/** The same lot written with LF, CRLF and a BOM must read alike (row numbers included). */
const validCell = (spec: LotFileSpec, column: number): fc.Arbitrary<string> => {
  if (spec.kind === 'resistor') {
    return fc.oneof(
      fc.double({ min: 1, max: 1e7, noNaN: true }).map((v) => v.toPrecision(6)),
      fc
        .tuple(fc.integer({ min: 1, max: 99 }), fc.constantFrom('R', 'k', 'K', 'M'), fc.nat(9))
        .map((t) => t.join('')),
    );
  }
  const t = TUBE_CATALOG[spec.tubeType].typical;
  const nominal =
    spec.quantity === 'ia-gm' ? [t.ia * 1e3, t.gm * 1e3][column % 2]! : [t.mu, t.rp][column % 2]!;
  // The catalog models reach a 12AX7's datasheet mu only just, so mu stays at or below typical.
  const top = spec.quantity === 'mu-rp' && column % 2 === 0 ? 1 : 1.1;
  return fc.double({ min: 0.9, max: top, noNaN: true }).map((f) => (nominal * f).toPrecision(5));
};

function validLotArb(spec: LotFileSpec): fc.Arbitrary<Lot> {
  const cols = columnsOf(spec);
  return fc.record({
    spec: fc.constant(spec),
    header: fc.constant(['serial', ...cols]),
    rows: fc.array(fc.tuple(fc.nat(9999).map(String), ...cols.map((_, i) => validCell(spec, i))), {
      minLength: 1,
      maxLength: 30,
    }),
    blanks: fc.array(fc.nat(30), { maxLength: 2 }),
  });
}

const plain = { delimiter: ',', eol: '\n', bom: false, quoteAll: false };
let cases = 0;
let oks = 0;
const parse = (text: string | Uint8Array, spec: LotFileSpec): ParsedLot => {
  cases++;
  const r = parseLotCsv(Buffer.from(text), spec);
  if (r.ok) oks++;
  return r;
};

describe('parseLotCsv fuzz', () => {
  it('structured CSV with odd headers, cells and formats: never throws, ok or row-level errors', () => {
    fc.assert(
      fc.property(
        specArb.chain((spec) => fc.tuple(lotArb(spec, cellArb), formatArb)),
        ([lot, format]) => {
          const { text, dataRows } = writeCsv(lot, format);
          checkContract(parse(text, lot.spec), lot.spec, dataRows);
        },
      ),
      { seed: 20261203, numRuns: 1_500 },
    );
  });

  it('random bytes and unicode text: never throws, ok or row-level errors', () => {
    const textArb = fc.oneof(
      fc.uint8Array({ maxLength: 2_000 }),
      fc.string({ unit: 'binary', maxLength: 500 }),
      fc
        .tuple(
          fc.constantFrom('value\n', 'ia1,gm1,ia2,gm2\n', 'mu1,rp1,mu2,rp2\r\n', '\uFEFFvalue\n'),
          fc.string({ unit: 'grapheme', maxLength: 300 }),
        )
        .map(([h, body]) => h + body),
      fc.constantFrom(
        '',
        '\n',
        '\r\n',
        '\uFEFF',
        '"',
        'value\n"470\n',
        'value\n' + '1\n'.repeat(MAX_LOT_ROWS + 1),
      ),
    );
    fc.assert(
      fc.property(specArb, textArb, (spec, text) => checkContract(parse(text, spec), spec)),
      { seed: 20261204, numRuns: 600 },
    );
  });

  it('a valid lot reads to the same values with CRLF line ends or a BOM as with LF', () => {
    let valid = 0;
    fc.assert(
      fc.property(
        specArb.chain(validLotArb),
        fc.constantFrom('\r\n', '\r'),
        fc.boolean(),
        (lot, eol, quoteAll) => {
          const lf = parse(writeCsv(lot, plain).text, lot.spec);
          checkContract(lf, lot.spec, lot.rows.length);
          expect(lf.ok).toBe(true);
          valid++;
          expect(parse(writeCsv(lot, { ...plain, eol }).text, lot.spec)).toEqual(lf);
          expect(parse(writeCsv(lot, { ...plain, bom: true }).text, lot.spec)).toEqual(lf);
          expect(parse(writeCsv(lot, { ...plain, eol, bom: true, quoteAll }).text, lot.spec)).toEqual(lf);
        },
      ),
      { seed: 20261205, numRuns: 200 },
    );
    expect(valid).toBe(200);
  });

  it('a valid lot with a few cells made extreme or odd: never throws, ok values finite and positive', () => {
    const extreme = fc.constantFrom(...ODD_CELLS.filter((c) => c.length < 50), '1e-310', '1e308', '1e-320');
    fc.assert(
      fc.property(
        specArb.chain(validLotArb),
        fc.array(fc.tuple(fc.nat(29), fc.nat(4), extreme), { minLength: 1, maxLength: 3 }),
        (lot, edits) => {
          const rows = lot.rows.map((r) => [...r]);
          for (const [r, c, v] of edits) {
            const row = rows[r % rows.length]!;
            row[1 + (c % (row.length - 1))] = v;
          }
          const { text, dataRows } = writeCsv({ ...lot, rows }, plain);
          checkContract(parse(text, lot.spec), lot.spec, dataRows);
        },
      ),
      { seed: 20261206, numRuns: 400 },
    );
  });

  it('refuses what the fuzz found stored as null or non-finite statistics, naming row and column', () => {
    const tube: LotFileSpec = {
      kind: 'tube',
      quantity: 'mu-rp',
      tubeType: '12AX7',
      testPoint: { va: 250, vg: -2 },
    };
    // A denormal rp made the current multiplier 1/(rp·ga) infinite: JSON would store it as null.
    const rp = parse('mu1,rp1,mu2,rp2\n95,1e-310,95,62k\n', tube);
    expect(rp.ok).toBe(false);
    if (!rp.ok)
      expect(rp.errors).toEqual([{ row: 2, column: 'rp1', message: expect.stringMatching(/range/) }]);
    // Values near the largest double overflowed the lot's mean and sd.
    const big = parse('value\n1e308\n1.7e308\n4k7\n', { kind: 'resistor' });
    expect(big.ok).toBe(false);
    if (!big.ok) expect(big.errors.map((e) => `${e.row}.${e.column}`)).toEqual(['2.value', '3.value']);
    // The ends of the range stay accepted.
    expect(parse('value\n1e-6\n1e12\n1T\n', { kind: 'resistor' })).toMatchObject({ ok: true, count: 3 });
  });

  it('ran at least 2,000 generated files', () => {
    expect(cases).toBeGreaterThanOrEqual(2_000);
    console.info(`parseLotCsv fuzz: ${cases} files parsed, ${oks} read ok, ${cases - oks} refused`);
  });
});
