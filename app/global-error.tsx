'use client';

export default function GlobalError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: 'system-ui, sans-serif', padding: '3rem', textAlign: 'center' }}>
        <h1>Scribeline could not load</h1>
        <p>Something went wrong on our side. Try again in a moment.</p>
        <button type="button" onClick={reset} style={{ minHeight: 44, padding: '0 1rem' }}>
          Try again
        </button>
      </body>
    </html>
  );
}
