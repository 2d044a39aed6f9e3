'use client';

import { useState, useTransition } from 'react';
import { archiveRigAction, restoreRigAction } from './actions';

/** Archive (or restore) a rig. Archiving hides it and stops its tokens; nothing is deleted. */
export function ArchiveButton({ rigId, rigName, archived }: { rigId: string; rigName: string; archived: boolean }) {
  const [pending, start] = useTransition();
  const [message, setMessage] = useState<string | null>(null);
  const act = () => {
    if (!archived && !window.confirm(`Archive “${rigName}”? Its tokens stop working until it is restored.`)) return;
    start(async () => {
      const res = archived ? await restoreRigAction({ rigId }) : await archiveRigAction({ rigId });
      setMessage(res.ok ? null : res.message);
    });
  };
  return (
    <span className="inline-flex items-center gap-2">
      <button type="button" className={archived ? 'btn' : 'btn btn-danger'} disabled={pending} onClick={act}>
        {pending ? 'Saving…' : archived ? 'Restore' : 'Archive rig'}
      </button>
      {message ? <span role="alert" className="text-xs text-danger">{message}</span> : null}
    </span>
  );
}
