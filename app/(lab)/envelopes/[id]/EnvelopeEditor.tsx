'use client';

import { EnvelopeWorkbench } from '@/components/canvas/EnvelopeWorkbench';
import type { Spec } from '@/lib/schedule/spec';
import { saveEnvelopeSpec } from '../actions';

/** The workbench bound to one saved envelope: save goes through the server action. */
export function EnvelopeEditor({ id, spec, readOnly, name }: { id: string; spec: Spec; readOnly: boolean; name: string }) {
  return (
    <EnvelopeWorkbench
      initialSpec={spec}
      readOnly={readOnly}
      downloadName={name}
      onSave={async (next) => {
        const res = await saveEnvelopeSpec({ id, spec: next });
        if (res.ok) return { ok: true };
        const errors = res.fieldErrors.map((f) => ({ path: f.path.replace(/^spec\./, ''), message: f.message }));
        return { ok: false, errors: errors.length ? errors : [{ path: '(root)', message: res.message }] };
      }}
    />
  );
}
