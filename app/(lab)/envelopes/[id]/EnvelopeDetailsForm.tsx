'use client';

import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { envelopeDetailsSchema } from '@/lib/envelopes/schema';
import { saveEnvelopeDetails } from '../actions';

type Values = z.input<typeof envelopeDetailsSchema>;

export function EnvelopeDetailsForm({ id, name, description, readOnly }: { id: string; name: string; description: string; readOnly: boolean }) {
  const [pending, start] = useTransition();
  const [status, setStatus] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<Values>({
    resolver: zodResolver(envelopeDetailsSchema),
    defaultValues: { name, description },
  });
  const onSubmit = handleSubmit((values) =>
    start(async () => {
      const res = await saveEnvelopeDetails({ id, ...values });
      if (res.ok) {
        setStatus('Saved.');
        reset(values);
      } else {
        for (const f of res.fieldErrors) setError(f.path as keyof Values, { message: f.message });
        setStatus(res.message);
      }
    }),
  );
  const errs = formState.errors;
  return (
    <form onSubmit={onSubmit} className="grid gap-3 md:grid-cols-[1fr_2fr_auto] md:items-end" noValidate>
      <div>
        <label htmlFor="env-name" className="label">Name</label>
        <input id="env-name" className="field" disabled={readOnly} {...register('name')} aria-invalid={Boolean(errs.name)}
          aria-describedby={errs.name ? 'env-name-err' : undefined} />
        {errs.name ? <p id="env-name-err" className="field-error">{errs.name.message}</p> : null}
      </div>
      <div>
        <label htmlFor="env-desc" className="label">Description</label>
        <input id="env-desc" className="field" disabled={readOnly} {...register('description')} aria-invalid={Boolean(errs.description)} />
        {errs.description ? <p className="field-error">{errs.description.message}</p> : null}
      </div>
      {readOnly ? null : (
        <div className="flex items-center gap-2">
          <button type="submit" className="btn" disabled={pending || !formState.isDirty}>Save details</button>
          {status ? <span role="status" className="text-xs text-ink-muted">{status}</span> : null}
        </div>
      )}
    </form>
  );
}
