/** A timestamp as a short local date and time ("2 Dec 2026, 00:14"); unparseable input is shown as given. */
export function formatWhen(iso: string | Date | undefined | null): string {
  if (!iso) return '—';
  const d = iso instanceof Date ? iso : new Date(iso);
  if (Number.isNaN(d.getTime())) return String(iso);
  return d.toLocaleString('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  });
}
