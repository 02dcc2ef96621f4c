'use client';

/** A friendly failure with a reference to quote; no stack trace or SQL reaches the page. */
export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main id="main" className="mx-auto max-w-lg px-4 py-16 text-center">
      <h1>Something went wrong</h1>
      <p className="mt-3 text-ink-soft">
        Nothing you entered was half-saved. Try again; if it keeps happening, tell us this reference:
      </p>
      <p className="mt-2 font-mono text-sm">{error.digest ?? 'unknown'}</p>
      <button type="button" onClick={reset} className="mt-6 btn-secondary">
        Try again
      </button>
    </main>
  );
}
