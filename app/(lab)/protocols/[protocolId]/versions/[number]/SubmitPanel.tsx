'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import type { FieldIssue } from '@/lib/http/errors';
import { submitVersionAction } from '../../../actions';
import { useDraftRevision } from './DraftRevision';

type Props = {
  versionId: string;
  revision: number;
  canSubmit: boolean;
  needsJustification: boolean;
  /** Why it cannot be submitted, when it cannot (failing rows, no rig, invalid spec). */
  blockers: string[];
};

/** Submit for review: blocked by hard limits, and asking for a written justification at warning level. */
export function SubmitPanel({ versionId, revision, canSubmit, needsJustification, blockers }: Props) {
  const router = useRouter();
  const { revision: current } = useDraftRevision(revision);
  const [justification, setJustification] = useState('');
  const [result, setResult] = useState<{ message: string; issues: FieldIssue[] } | null>(null);
  const [pending, start] = useTransition();
  const fieldError = result?.issues.find((i) => i.path === 'justification')?.message;
  const others = result?.issues.filter((i) => i.path !== 'justification') ?? [];

  return (
    <section aria-labelledby="submit-title" className="card space-y-3">
      <h2 id="submit-title" className="text-base">Submit for review</h2>
      {!canSubmit ? (
        <div role="note" className="rounded-md border border-danger/50 bg-danger-soft px-3 py-2 text-sm">
          <p className="font-semibold">This version cannot be submitted yet.</p>
          <ul className="mt-1 list-disc pl-5">{blockers.map((b) => <li key={b}>{b}</li>)}</ul>
        </div>
      ) : (
        <form
          className="space-y-3"
          aria-label="Submit for review"
          onSubmit={(e) => {
            e.preventDefault();
            start(async () => {
              setResult(null);
              const res = await submitVersionAction({ versionId, revision: current, justification });
              if (res.ok) router.refresh();
              else setResult({ message: res.message, issues: res.fieldErrors });
            });
          }}
        >
          <p className="text-sm text-ink-muted">
            Submitting freezes this version as last saved and asks the lab’s safety officers to review it. The schedule’s checksum is recorded now.
          </p>
          {needsJustification ? (
            <div>
              <label htmlFor="submit-justification" className="label">Justification for the warnings</label>
              <textarea
                id="submit-justification"
                rows={3}
                className="field"
                value={justification}
                onChange={(e) => setJustification(e.target.value)}
                aria-invalid={Boolean(fieldError)}
                aria-describedby={fieldError ? 'submit-justification-err' : 'submit-justification-help'}
              />
              {fieldError ? (
                <p id="submit-justification-err" className="field-error">{fieldError}</p>
              ) : (
                <p id="submit-justification-help" className="mt-1 text-xs text-ink-muted">Some values are at warning level. Say in writing why they are needed; the officer reads this.</p>
              )}
            </div>
          ) : null}
          {result ? (
            <div role="alert" className="text-sm text-danger">
              <p>{result.message}</p>
              {others.length ? <ul className="mt-1 list-disc pl-5">{others.map((i) => <li key={i.path + i.message}>{i.message}</li>)}</ul> : null}
            </div>
          ) : null}
          <button type="submit" className="btn btn-primary" disabled={pending}>{pending ? 'Submitting…' : 'Submit for review'}</button>
        </form>
      )}
    </section>
  );
}
