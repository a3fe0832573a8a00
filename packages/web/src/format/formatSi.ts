/** Number formatting for the whole app: SI prefixes, significant figures, a true minus sign. */

const PREFIXES: Record<number, string> = {
  [-12]: 'p',
  [-9]: 'n',
  [-6]: 'µ',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'M',
  9: 'G',
};

/** Units that never take an SI prefix (logarithmic or already relative). */
const NO_PREFIX = new Set(['dB', '%', 'PPM', '°', '']);

export const MINUS = '\u2212';

/** Replace the ASCII hyphen-minus of a formatted number with a typographic minus. */
function minus(text: string): string {
  return text.startsWith('-') ? MINUS + text.slice(1) : text;
}

/** Round to `digits` significant figures and drop trailing zeros after the point. */
export function formatSig(value: number, digits = 3): string {
  if (Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return value > 0 ? '∞' : `${MINUS}∞`;
  if (value === 0) return '0';
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-4) {
    const [m, e] = value.toExponential(digits - 1).split('e');
    return minus(`${trimZeros(m)}e${Number(e)}`);
  }
  // Number() turns toPrecision's exponent form (180 at 2 digits → "1.8e+2") back into plain digits.
  return minus(String(Number(value.toPrecision(digits))));
}

function trimZeros(text: string): string {
  if (!text.includes('.')) return text;
  return text.replace(/0+$/, '').replace(/\.$/, '');
}

/**
 * Format a value with an SI prefix chosen so the mantissa lies in [1, 1000).
 * `formatSi(4700, 'Ω')` → "4.7 kΩ"; `formatSi(0.00123, 'A')` → "1.23 mA"; `formatSi(-3.2, 'dB')` → "−3.2 dB".
 */
export function formatSi(value: number, unit = '', digits = 3): string {
  const sep = unit ? ' ' : '';
  if (!Number.isFinite(value) || NO_PREFIX.has(unit) || value === 0) {
    return `${formatSig(value, digits)}${sep}${unit}`;
  }
  let exp = Math.floor(Math.log10(Math.abs(value)) / 3) * 3;
  exp = Math.min(9, Math.max(-12, exp));
  let mantissa = Number((value / 10 ** exp).toPrecision(digits));
  // Rounding can carry into the next prefix (999.96 → 1000): move up one step.
  if (Math.abs(mantissa) >= 1000 && exp < 9) {
    exp += 3;
    mantissa = Number((value / 10 ** exp).toPrecision(digits));
  }
  return `${formatSig(mantissa, digits)} ${PREFIXES[exp]}${unit}`;
}

/** A fraction as a percentage with `decimals` places: `formatPercent(0.9987, 2)` → "99.87 %". */
export function formatPercent(fraction: number, decimals = 1): string {
  if (!Number.isFinite(fraction)) return '—';
  return `${minus((fraction * 100).toFixed(decimals))} %`;
}

/**
 * A yield (fraction in [0, 1]) with enough decimals that the reject share keeps two significant
 * figures: 0.95 → "95.0 %", 0.99987 → "99.987 %", 1 → "100 %".
 */
export function formatYield(fraction: number): string {
  if (!Number.isFinite(fraction)) return '—';
  if (fraction >= 1) return '100 %';
  const reject = 1 - fraction;
  const decimals = Math.min(6, Math.max(1, Math.ceil(-Math.log10(reject)) - 1));
  const text = formatPercent(fraction, decimals);
  // A share within 0.5 PPM of 1 (e.g. an interval's upper bound) rounds to 100 %: say so plainly.
  return text.startsWith('100.') ? '100 %' : text;
}

/** Reject rate in parts per million, grouped by thousands: 1234.4 → "1,234 PPM". */
export function formatPpm(ppm: number): string {
  if (!Number.isFinite(ppm)) return '—';
  const rounded = ppm >= 100 ? Math.round(ppm) : Number(ppm.toPrecision(2));
  return `${rounded.toLocaleString('en-US')} PPM`;
}

/** A whole count with thousands grouping: 100000 → "100,000". */
export function formatCount(n: number): string {
  return Number.isFinite(n) ? Math.round(n).toLocaleString('en-US') : '—';
}
