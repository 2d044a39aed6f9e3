'use client';

import { useRouter } from 'next/navigation';
import { EnvelopeWorkbench } from '@/components/canvas/EnvelopeWorkbench';
import type { Spec } from '@/lib/schedule/spec';
import { saveDraftSpecAction } from '../../../actions';
import { useDraftRevision } from './DraftRevision';

/** The workbench on a draft version: saving goes through the workflow, then the sheet is recomputed. */
export function DraftEditor({ versionId, spec, name }: { versionId: string; spec: Spec; name: string }) {
  const router = useRouter();
  const { setRevision } = useDraftRevision(0);
  return (
    <EnvelopeWorkbench
      initialSpec={spec}
      downloadName={name}
      onSave={async (next) => {
        const res = await saveDraftSpecAction({ versionId, spec: next });
        if (res.ok) {
          setRevision(res.data.revision);
          router.refresh();
          return { ok: true };
        }
        const errors = res.fieldErrors.map((f) => ({ path: f.path.replace(/^spec\./, ''), message: f.message }));
        return { ok: false, errors: errors.length ? errors : [{ path: '(root)', message: res.message }] };
      }}
    />
  );
}
