/** A speech bubble with a question mark: a reader asking about a moment. */
export function ReaderQuestionIcon({ className = 'h-4 w-4' }: { className?: string }) {
  return (
    <svg viewBox="0 0 20 20" aria-hidden="true" className={`shrink-0 ${className}`} fill="none" stroke="currentColor" strokeWidth={1.8} strokeLinecap="round" strokeLinejoin="round">
      <path d="M3 4.5A1.5 1.5 0 0 1 4.5 3h11A1.5 1.5 0 0 1 17 4.5v8a1.5 1.5 0 0 1-1.5 1.5H9l-4 3v-3h-.5A1.5 1.5 0 0 1 3 12.5z" />
      <path d="M8.3 6.9a1.8 1.8 0 1 1 2.5 1.7c-.5.2-.8.6-.8 1.1v.3" />
      <circle cx="10" cy="11.9" r="0.35" fill="currentColor" />
    </svg>
  );
}
