/** Sigmatail's mark: a bell curve riding over a tail, drawn as one stroke. */
export function Logo({ className = '' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <circle cx="16" cy="16" r="15" fill="#0f3b3a" />
      <path
        d="M5 22 C10 22 11 8 16 8 C21 8 22 22 27 22"
        stroke="#f2a33a"
        strokeWidth="2.4"
        fill="none"
        strokeLinecap="round"
      />
      <path d="M16 22 V27" stroke="#fffdf7" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}
