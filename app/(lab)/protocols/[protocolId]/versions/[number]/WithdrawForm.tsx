'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { withdrawVersionAction } from '../../../actions';

/** Withdraw: an author pulls a submission back, or an officer takes an approval out of use. */
export function WithdrawForm({ versionId, revision, approved }: { versionId: string; revision: number; approved: boolean }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  if (!open) {
    return (
      <button type="button" className="btn" onClick={() => setOpen(true)}>
        {approved ? 'Withdraw approval…' : 'Withdraw from review…'}
      </button>
    );
  }
  return (
    <form
      className="card w-full space-y-2"
      aria-label="Withdraw this version"
      onSubmit={(e) => {
        e.preventDefault();
        start(async () => {
          setError(null);
          const res = await withdrawVersionAction({ versionId, revision, reason });
          if (res.ok) router.refresh();
          else setError(res.fieldErrors.find((f) => f.path === 'reason')?.message ?? res.message);
        });
      }}
    >
      <p className="text-sm">
        {approved ? 'Rigs will no longer be able to fetch this version. ' : 'The version leaves the review queue. '}
        A withdrawn version stays on record and can be copied into a new one.
      </p>
      <label htmlFor="withdraw-reason" className="label">Reason</label>
      <textarea id="withdraw-reason" rows={2} className="field" value={reason} onChange={(e) => setReason(e.target.value)} aria-describedby={error ? 'withdraw-err' : undefined} />
      {error ? <p id="withdraw-err" role="alert" className="field-error">{error}</p> : null}
      <div className="flex gap-2">
        <button type="submit" className="btn btn-danger" disabled={pending}>{pending ? 'Withdrawing…' : 'Withdraw'}</button>
        <button type="button" className="btn" onClick={() => setOpen(false)}>Cancel</button>
      </div>
    </form>
  );
}
