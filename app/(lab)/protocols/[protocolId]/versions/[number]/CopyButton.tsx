'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { copyVersionAction } from '../../../actions';

/** Starts version n+1 as a draft with this version's spec and rig. */
export function CopyButton({ versionId, label }: { versionId: string; label: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  return (
    <span className="inline-flex flex-col gap-1">
      <button
        type="button"
        className="btn btn-primary"
        disabled={pending}
        onClick={() =>
          start(async () => {
            setError(null);
            const res = await copyVersionAction({ versionId });
            if (res.ok) router.push(`/protocols/${res.data.protocolId}/versions/${res.data.number}`);
            else setError(res.message);
          })
        }
      >
        {pending ? 'Copying…' : label}
      </button>
      {error ? <span role="alert" className="field-error">{error}</span> : null}
    </span>
  );
}
