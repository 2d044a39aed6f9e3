'use client';

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-md px-6 py-24 text-center">
      <h1>Something went wrong</h1>
      <p className="mt-2 text-sm text-ink-muted">
        Pulseloom could not finish this request. If it keeps happening, the database may be unavailable; ask whoever
        runs this installation to check it.
      </p>
      {error.digest ? <p className="mt-2 font-mono text-xs text-ink-muted">reference {error.digest}</p> : null}
      <button type="button" className="btn mt-6" onClick={reset}>Try again</button>
    </main>
  );
}
