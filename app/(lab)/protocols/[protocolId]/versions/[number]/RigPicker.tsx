'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { setDraftRigAction } from '../../../actions';
import { useDraftRevision } from './DraftRevision';

type Rig = { id: string; name: string; clockHz: number; archived: boolean };

/** Which of the protocol's rigs this draft runs on; the spec takes that rig's clock. */
export function RigPicker({ versionId, rigId, rigs }: { versionId: string; rigId: string | null; rigs: Rig[] }) {
  const router = useRouter();
  const { setRevision } = useDraftRevision(0);
  const [value, setValue] = useState(rigId ?? '');
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const current = rigs.find((r) => r.id === rigId);
  return (
    <form
      className="flex flex-wrap items-end gap-3"
      aria-label="Rig"
      onSubmit={(e) => {
        e.preventDefault();
        start(async () => {
          setError(null);
          const res = await setDraftRigAction({ versionId, rigId: value });
          if (res.ok) {
            setRevision(res.data.revision);
            router.refresh();
          } else setError(res.fieldErrors[0]?.message ?? res.message);
        });
      }}
    >
      <div>
        <label htmlFor="draft-rig" className="label">Runs on</label>
        <select id="draft-rig" className="field" value={value} onChange={(e) => setValue(e.target.value)} aria-describedby="draft-rig-help">
          {rigId === null ? <option value="">Choose a rig</option> : null}
          {rigs.map((r) => (
            <option key={r.id} value={r.id} disabled={r.archived}>
              {r.name} — {r.clockHz.toLocaleString('en')} Hz{r.archived ? ' (archived)' : ''}
            </option>
          ))}
        </select>
      </div>
      <button type="submit" className="btn" disabled={pending || value === '' || value === rigId}>
        {pending ? 'Changing…' : 'Use this rig'}
      </button>
      <p id="draft-rig-help" className="w-full text-xs text-ink-muted">
        The schedule is placed on the rig’s output clock{current ? ` (${current.clockHz.toLocaleString('en')} Hz)` : ''}; changing the rig changes the clock and so the schedule.
      </p>
      {error ? <p role="alert" className="field-error w-full">{error}</p> : null}
    </form>
  );
}
