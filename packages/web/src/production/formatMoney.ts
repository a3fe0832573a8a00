/**
 * A price with its currency code, two decimals (three below 0.1, for parts that cost cents).
 *
 * @example formatMoney(0.045, 'EUR') // "0.045 EUR"
 */
export function formatMoney(value: number | null | undefined, currency: string): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const digits = Math.abs(value) < 0.1 && value !== 0 ? 3 : 2;
  return `${value.toFixed(digits)}${currency ? ` ${currency}` : ''}`;
}
