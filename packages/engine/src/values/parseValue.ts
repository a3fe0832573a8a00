/** What a value denotes; decides which letters are multipliers. */
export type ValueKind = 'resistance' | 'capacitance';

/** Result of parsing a value: ohms or farads, or an error naming the text. */
export type ParseResult = { ok: true; value: number } | { ok: false; error: string };

// IEC 60062 RKM multiplier letters. 'R' (resistance) is ×1; 'F' (capacitance) is ×1.
// 'K' is accepted as kilo too because it is common on drawings (common practice, no source).
const RES_LETTERS: Record<string, number> = { R: 1, r: 1, k: 1e3, K: 1e3, M: 1e6, G: 1e9, T: 1e12, m: 1e-3 };
const CAP_LETTERS: Record<string, number> = { p: 1e-12, n: 1e-9, u: 1e-6, µ: 1e-6, μ: 1e-6, m: 1e-3, F: 1 };

const RKM = /^(\d*)([A-Za-zµμ])(\d*)$/;
const ENGINEERING = /^([+]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*([A-Za-zµμ]?)$/;

function stripUnit(text: string, kind: ValueKind): string {
  if (kind === 'resistance') return text.replace(/\s*(Ω|ohms?|Ohms?)$/, '');
  // A trailing F is the unit when a multiplier letter precedes it ('470nF'); a lone 'F' is RKM.
  return /[pnuµμm]F$/.test(text) ? text.slice(0, -1) : text;
}

/**
 * Parses a resistance or capacitance written as a plain number, engineering notation
 * ('2.2k', '470n', '4.7e3') or an IEC 60062 RKM code ('4k7', '1M5', '220R', 'R47', '4n7').
 * Returns ohms or farads; invalid text gives an error message naming it.
 *
 * @example
 * parseValue('4k7', 'resistance'); // { ok: true, value: 4700 }
 * parseValue('4x7', 'resistance'); // { ok: false, error: 'not a resistance: "4x7"' }
 */
export function parseValue(text: string, kind: ValueKind): ParseResult {
  const bad: ParseResult = { ok: false, error: `not a ${kind}: "${text}"` };
  if (typeof text !== 'string') return bad;
  const letters = kind === 'resistance' ? RES_LETTERS : CAP_LETTERS;
  const t = stripUnit(text.trim(), kind);
  if (t === '') return bad;
  let value = Number.NaN;
  const rkm = RKM.exec(t);
  const eng = ENGINEERING.exec(t);
  if (rkm && (rkm[1] !== '' || rkm[3] !== '') && rkm[2] in letters && (rkm[3] !== '' || rkm[1] !== '')) {
    const mult = letters[rkm[2]];
    value = Number(`${rkm[1] || '0'}.${rkm[3] || '0'}`) * mult;
  } else if (eng) {
    const mult = eng[2] === '' ? 1 : letters[eng[2]];
    if (mult === undefined) return bad;
    value = Number(eng[1]) * mult;
  }
  if (!Number.isFinite(value) || value <= 0) return bad;
  return { ok: true, value: roundSignificant(value) };
}

/** Removes binary noise from decimal scaling (4.7·1e3 = 4700.000000000001). */
function roundSignificant(x: number): number {
  return Number(x.toPrecision(12));
}

/**
 * Parses a resistance (see {@link parseValue}); throws an Error naming the text when invalid.
 *
 * @example
 * parseResistance('1M5'); // 1500000 (Ω)
 */
export function parseResistance(text: string | number): number {
  if (typeof text === 'number') {
    if (Number.isFinite(text) && text > 0) return text;
    throw new Error(`not a resistance: ${text}`);
  }
  const r = parseValue(text, 'resistance');
  if (!r.ok) throw new Error(r.error);
  return r.value;
}

/**
 * Parses a capacitance (see {@link parseValue}); throws an Error naming the text when invalid.
 *
 * @example
 * parseCapacitance('470n'); // 4.7e-7 (F)
 */
export function parseCapacitance(text: string | number): number {
  if (typeof text === 'number') {
    if (Number.isFinite(text) && text > 0) return text;
    throw new Error(`not a capacitance: ${text}`);
  }
  const r = parseValue(text, 'capacitance');
  if (!r.ok) throw new Error(r.error);
  return r.value;
}
