'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { decideVersionAction } from '../actions';

/** Approve, or return with comments. The revision is the one this page showed. */
export function DecisionForm({ versionId, revision, checksum }: { versionId: string; revision: number; checksum: string | null }) {
  const router = useRouter();
  const [decision, setDecision] = useState<'approve' | 'return'>('approve');
  const [comment, setComment] = useState('');
  const [error, setError] = useState<{ message: string; comment?: string } | null>(null);
  const [pending, start] = useTransition();

  return (
    <form
      id="decision"
      className="card space-y-3"
      aria-label="Decision"
      onSubmit={(e) => {
        e.preventDefault();
        start(async () => {
          setError(null);
          const res = await decideVersionAction({ versionId, revision, decision, comment });
          if (res.ok) router.refresh();
          else setError({ message: res.message, comment: res.fieldErrors.find((f) => f.path === 'comment')?.message });
        });
      }}
    >
      <h2 className="text-base">Decision</h2>
      <fieldset>
        <legend className="sr-only">Approve or return</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          <label className="flex items-center gap-1.5">
            <input type="radio" name="decision" value="approve" checked={decision === 'approve'} onChange={() => setDecision('approve')} />
            Approve
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" name="decision" value="return" checked={decision === 'return'} onChange={() => setDecision('return')} />
            Return with comments
          </label>
        </div>
      </fieldset>
      <div>
        <label htmlFor="decision-comment" className="label">{decision === 'return' ? 'What needs to change' : 'Comment (optional)'}</label>
        <textarea
          id="decision-comment"
          rows={4}
          className="field"
          value={comment}
          onChange={(e) => setComment(e.target.value)}
          aria-invalid={Boolean(error?.comment)}
          aria-describedby={error?.comment ? 'decision-comment-err' : undefined}
        />
        {error?.comment ? <p id="decision-comment-err" className="field-error">{error.comment}</p> : null}
      </div>
      {decision === 'approve' && checksum ? (
        <p className="text-xs text-ink-muted">
          You approve exactly the schedule with checksum <code className="break-all font-mono">{checksum}</code>; it is regenerated and checked again as you approve.
        </p>
      ) : null}
      {error ? <p role="alert" className="text-sm text-danger">{error.message}</p> : null}
      <button type="submit" className={decision === 'approve' ? 'btn btn-primary' : 'btn btn-danger'} disabled={pending}>
        {pending ? 'Saving…' : decision === 'approve' ? 'Approve this version' : 'Return to the author'}
      </button>
    </form>
  );
}
