'use client';

import { useState, useTransition } from 'react';
import { deleteLimitProfileAction } from './actions';

/** Two steps, so a stray click or Enter never removes a lab's limits. */
export function DeleteProfileButton({ id, name }: { id: string; name: string }) {
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  if (!confirming) {
    return (
      <button type="button" className="btn" onClick={() => setConfirming(true)} aria-label={`Delete ${name}`}>
        Delete
      </button>
    );
  }
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <button
        type="button"
        className="btn btn-danger"
        disabled={pending}
        autoFocus
        onClick={() =>
          start(async () => {
            const res = await deleteLimitProfileAction({ id });
            if (!res.ok) setError(res.message);
          })
        }
      >
        {pending ? 'Deleting…' : 'Confirm delete'}
      </button>
      <button type="button" className="btn" onClick={() => setConfirming(false)} disabled={pending}>
        Keep
      </button>
      {error ? <span role="alert" className="text-xs text-danger">{error}</span> : null}
    </span>
  );
}
