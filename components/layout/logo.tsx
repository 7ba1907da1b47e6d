/** Scribeline's mark: a scribed line crossing a dimension tick. */
export function Logo({ className = '' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect x="1" y="1" width="30" height="30" rx="6" fill="var(--color-dye)" />
      <path d="M6 22 L26 10" stroke="var(--color-scribe)" strokeWidth="3" strokeLinecap="round" />
      <path d="M9 8 v16 M23 8 v16" stroke="#fff" strokeWidth="1.6" strokeLinecap="round" opacity="0.9" />
    </svg>
  );
}
