import type { ValueKind } from './parseValue.js';

const RES_PREFIXES: [number, string][] = [
  [1e12, 'T'],
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, 'R'],
];
const CAP_PREFIXES: [number, string][] = [
  [1, 'F'],
  [1e-3, 'm'],
  [1e-6, 'u'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

function pickPrefix(value: number, kind: ValueKind): [number, string] {
  const table = kind === 'resistance' ? RES_PREFIXES : CAP_PREFIXES;
  for (const entry of table) if (value >= entry[0] * 0.9999999) return entry;
  return table[table.length - 1];
}

function mantissa(value: number, scale: number, digits: number): string {
  return String(Number((value / scale).toPrecision(digits)));
}

/**
 * Formats ohms or farads as an IEC 60062 RKM code: the multiplier letter stands in for the
 * decimal point ('4k7', '1M5', '220R', 'R47', '4n7', '2u2'). Up to `digits` significant digits.
 *
 * @example
 * formatRkm(4700, 'resistance'); // '4k7'
 * formatRkm(0.47, 'resistance'); // 'R47'
 * formatRkm(4.7e-9, 'capacitance'); // '4n7'
 */
export function formatRkm(value: number, kind: ValueKind, digits = 4): string {
  if (!Number.isFinite(value) || value <= 0) return String(value);
  if (kind === 'resistance' && value < 1) return `R${mantissa(value, 1, digits).replace(/^0\./, '')}`;
  const [scale, letter] = pickPrefix(value, kind);
  const m = mantissa(value, scale, digits);
  const [int, frac] = m.split('.');
  if (int === '0') return `${letter}${frac}`;
  return `${int}${letter}${frac ?? ''}`;
}

/**
 * Formats ohms or farads in engineering notation with a space and unit ('4.7 kΩ', '470 nF').
 *
 * @example
 * formatEngineering(4700, 'resistance'); // '4.7 kΩ'
 * formatEngineering(4.7e-7, 'capacitance'); // '470 nF'
 */
export function formatEngineering(value: number, kind: ValueKind, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  const unit = kind === 'resistance' ? 'Ω' : 'F';
  if (value <= 0) return `${value} ${unit}`;
  if (kind === 'resistance' && value < 1) return `${mantissa(value, 1e-3, digits)} m${unit}`;
  const [scale, letter] = pickPrefix(value, kind);
  const prefix = letter === 'R' || letter === 'F' ? '' : letter === 'u' ? 'µ' : letter;
  return `${mantissa(value, scale, digits)} ${prefix}${unit}`;
}
