import { formatSi } from '../format/formatSi.js';

/**
 * An interval as text, the unit said once when both ends share it: "56 – 58.3 V", else
 * "980 mV – 1.02 V"; "—" when there is none.
 */
export function intervalText(interval: readonly [number, number] | null | undefined, unit: string): string {
  if (!interval) return '—';
  const lo = formatSi(interval[0], unit);
  const hi = formatSi(interval[1], unit);
  const unitOf = (t: string) => t.slice(t.lastIndexOf(' ') + 1);
  return unitOf(lo) === unitOf(hi) && lo.includes(' ')
    ? `${lo.slice(0, lo.lastIndexOf(' '))} – ${hi}`
    : `${lo} – ${hi}`;
}
