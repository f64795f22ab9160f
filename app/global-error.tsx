'use client';

// Replaces the root layout when it fails, so it brings its own html and minimal styling.
export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: 'system-ui, sans-serif', background: '#fbf9f5', color: '#2a2621', padding: '4rem 1rem' }}>
        <main style={{ maxWidth: '32rem', margin: '0 auto', textAlign: 'center' }}>
          <h1 style={{ fontSize: '1.25rem' }}>Branchwise could not start this page</h1>
          <p>The problem is on our side. Try again in a moment.</p>
          {error.digest && <p style={{ fontSize: '0.75rem' }}>Reference: {error.digest}</p>}
          <button type="button" onClick={reset} style={{ padding: '0.5rem 1rem', marginTop: '1rem' }}>
            Try again
          </button>
        </main>
      </body>
    </html>
  );
}
