import { formatSi } from '../format/formatSi.js';

/**
 * A spec's limits in words, with the metric's unit.
 *
 * @example specLimitsText({ min: -0.5, max: 0.5 }, 'dB') // "≥ −0.5 dB, ≤ 0.5 dB"
 */
export function specLimitsText(s: { min: number | null; max: number | null }, unit: string): string {
  return [
    s.min !== null ? `≥ ${formatSi(s.min, unit)}` : '',
    s.max !== null ? `≤ ${formatSi(s.max, unit)}` : '',
  ]
    .filter(Boolean)
    .join(', ');
}
