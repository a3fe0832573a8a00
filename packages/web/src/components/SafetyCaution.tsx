/** The high-voltage caution carried by design pages, run pages and printed reports. */
export function SafetyCaution({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      role="note"
      aria-label="Safety caution"
      className="print-break flex gap-3 rounded-md border border-brass/40 bg-brass-soft px-4 py-3 text-sm text-ink"
    >
      <svg aria-hidden="true" viewBox="0 0 24 24" className="mt-0.5 h-5 w-5 flex-none text-brass">
        <path d="M12 2 L23 21 H1 Z" fill="currentColor" />
        <path d="M13 7 L9.5 13.5 H12.5 L11 18.5 L15 11.5 H12 Z" fill="#fffdf7" />
      </svg>
      <p>
        <strong className="font-semibold">High voltage.</strong> These circuits carry lethal voltages even
        when switched off: discharge filter capacitors before touching anything and respect every part and
        tube rating.
        {!compact && (
          <>
            {' '}
            Sigmatail is a design aid; its results do not replace local electrical codes or licensed practice.
          </>
        )}
      </p>
    </aside>
  );
}
