import {
  LOT_COLUMNS,
  MAX_LOT_ROW_ERRORS,
  MAX_LOT_ROWS,
  TUBE_CATALOG,
  parseValue,
  sectionMultipliers,
  type SectionMeasurement,
  type TestPoint,
  type TubeType,
} from '@sigmatail/engine';
import type { ResistorLotData, TubeLotData } from '@sigmatail/db';
import { CsvError, parse } from 'csv-parse/sync';

/** What the upload form says about the file. */
export type LotFileSpec =
  | { kind: 'resistor' }
  | { kind: 'tube'; quantity: 'ia-gm' | 'mu-rp'; tubeType: TubeType; testPoint: TestPoint };

/** One problem in the file: CSV line (1 = header), column name ('' = the whole row) and why. */
export type LotRowError = { row: number; column: string; message: string };

export type ParsedLot =
  | { ok: true; count: number; data: ResistorLotData | TubeLotData }
  | { ok: false; errors: LotRowError[]; errorCount: number; message: string };

type Row = { record: Record<string, string>; info: { lines: number } };

/**
 * Parses an uploaded lot CSV (header row, then one part or one tube per row) with csv-parse and
 * checks every row. Either every row is good and the values come back, or nothing does and the
 * first MAX_LOT_ROW_ERRORS problems are listed (so a half-good file is never stored).
 * Resistors: column `value` in ohms, engineering notation or RKM (4k7). Tubes: `ia1, gm1, ia2, gm2`
 * (mA, mA/V) or `mu1, rp1, mu2, rp2` (rp in ohms or RKM), turned into model multipliers at the test point.
 */
export function parseLotCsv(file: Buffer, spec: LotFileSpec): ParsedLot {
  let rows: Row[];
  try {
    rows = parse(file, {
      columns: (header: string[]) => header.map((h) => h.trim().toLowerCase()),
      skip_empty_lines: true,
      trim: true,
      bom: true,
      info: true,
      relax_column_count: true,
      to: MAX_LOT_ROWS + 1,
    }) as unknown as Row[];
  } catch (err) {
    if (!(err instanceof CsvError)) throw err;
    const row = (err as CsvError & { lines?: number }).lines ?? 1;
    return refuse([{ row, column: '', message: `not readable as CSV: ${err.message}` }], 1);
  }
  if (rows.length === 0) return refuse([{ row: 1, column: '', message: 'no data rows under the header' }], 1);
  if (rows.length > MAX_LOT_ROWS) {
    return refuse(
      [{ row: rows[MAX_LOT_ROWS]!.info.lines, column: '', message: `more than ${MAX_LOT_ROWS} rows` }],
      1,
    );
  }
  const columns = spec.kind === 'resistor' ? LOT_COLUMNS.resistor : LOT_COLUMNS[spec.quantity];
  const present = Object.keys(rows[0]!.record);
  const missing = columns.filter((c) => !present.includes(c));
  if (missing.length > 0) {
    return refuse(
      missing.map((c) => ({
        row: 1,
        column: c,
        message: `the header has no '${c}' column (needs ${columns.join(', ')})`,
      })),
      missing.length,
    );
  }
  const errors: LotRowError[] = [];
  let errorCount = 0;
  const fail = (e: LotRowError) => {
    errorCount++;
    if (errors.length < MAX_LOT_ROW_ERRORS) errors.push(e);
  };
  if (spec.kind === 'resistor') {
    const values: number[] = [];
    for (const { record, info } of rows) {
      const v = readNumber(record.value, 'ohms');
      if (typeof v === 'string') fail({ row: info.lines, column: 'value', message: v });
      else values.push(v);
    }
    return errorCount > 0 ? refuse(errors, errorCount) : { ok: true, count: values.length, data: { values } };
  }
  const model = TUBE_CATALOG[spec.tubeType].model;
  const sections: number[][] = [];
  const multipliers: number[][] = [];
  for (const { record, info } of rows) {
    const nums = columns.map((c, i) => {
      const v = readNumber(record[c], spec.quantity === 'mu-rp' && i % 2 === 1 ? 'ohms' : 'plain');
      if (typeof v === 'string') fail({ row: info.lines, column: c, message: v });
      return v;
    });
    if (nums.some((v) => typeof v === 'string')) continue;
    const [a1, b1, a2, b2] = nums as number[];
    const m = [section(a1!, b1!), section(a2!, b2!)];
    let ok = true;
    m.forEach((x, s) => {
      if (typeof x === 'string') {
        ok = false;
        fail({ row: info.lines, column: columns[2 * s]!, message: x });
      }
    });
    if (!ok) continue;
    const [s1, s2] = m as { perv: number; mu: number }[];
    sections.push([a1!, b1!, a2!, b2!]);
    multipliers.push([s1!.perv, s2!.perv, s1!.mu, s2!.mu]);
  }
  if (errorCount > 0) return refuse(errors, errorCount);
  return { ok: true, count: sections.length, data: { sections, multipliers } };

  function section(a: number, b: number): { perv: number; mu: number } | string {
    if (spec.kind !== 'tube') return 'not a tube lot';
    const m: SectionMeasurement =
      spec.quantity === 'ia-gm'
        ? { quantity: 'ia-gm', ia: a / 1e3, gm: b / 1e3 }
        : { quantity: 'mu-rp', mu: a, rp: b };
    try {
      const x = sectionMultipliers(model, spec.testPoint, m);
      // Stored as JSON, where an infinite multiplier would silently become null.
      const usable = (v: number) => Number.isFinite(v) && v > 0;
      return usable(x.perv) && usable(x.mu) ? x : 'gives no finite model multiplier at this test point';
    } catch (err) {
      if (err instanceof RangeError) return err.message;
      throw err;
    }
  }
}

// Plausible magnitudes of any measured value (ohms, mA, mA/V, mu): 1 µ to 1 T, the span of the
// RKM letters and then some (common practice, no source). Inside it a lot's sums, spreads and
// model multipliers stay finite; outside it a value is a typing slip, not a part.
const SMALLEST = 1e-6;
const LARGEST = 1e12;

/** A positive number, or why not. 'ohms' also accepts engineering notation and RKM codes. */
function readNumber(text: string | undefined, kind: 'ohms' | 'plain'): number | string {
  if (text === undefined || text === '') return 'empty';
  let v: number;
  if (kind === 'ohms') {
    const r = parseValue(text, 'resistance');
    if (!r.ok) return `not a resistance: "${text.slice(0, 40)}" (use ohms, 2.2k or an RKM code like 4k7)`;
    v = r.value;
  } else {
    v = Number(text);
    if (!Number.isFinite(v)) return `not a number: "${text.slice(0, 40)}"`;
  }
  if (!(v > 0)) return `must be positive (got ${text.slice(0, 40)})`;
  if (v < SMALLEST || v > LARGEST)
    return `out of range: ${text.slice(0, 40)} (must be ${SMALLEST} to ${LARGEST})`;
  return v;
}

function refuse(errors: LotRowError[], errorCount: number): ParsedLot {
  return {
    ok: false,
    errors,
    errorCount,
    message:
      errorCount === 1
        ? 'the file has 1 problem; nothing was stored'
        : `the file has ${errorCount} problems; nothing was stored`,
  };
}
