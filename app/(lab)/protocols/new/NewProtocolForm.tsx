'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { protocolFormSchema, type ProtocolFormInput } from '@/lib/versions/schemas';
import { createProtocolAction } from '../actions';

type Rig = { id: string; name: string; modality: 'optical' | 'electrical'; clockHz: number };
type Envelope = { id: string; name: string; modality: 'optical' | 'electrical' };

export function NewProtocolForm({ rigs, envelopes }: { rigs: Rig[]; envelopes: Envelope[] }) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, watch, setValue } = useForm<ProtocolFormInput>({
    resolver: zodResolver(protocolFormSchema),
    defaultValues: { name: '', purpose: '', modality: 'optical', target: '', rigIds: [], startFrom: 'example' },
  });
  const modality = watch('modality');
  const chosen = watch('rigIds');
  // Kept in the order ticked: the first one ticked carries version 1.
  const toggleRig = (id: string, on: boolean) =>
    setValue('rigIds', on ? [...chosen.filter((x) => x !== id), id] : chosen.filter((x) => x !== id), { shouldValidate: formState.isSubmitted });
  const usable = rigs.filter((r) => r.modality === modality);
  const starts = envelopes.filter((e) => e.modality === modality);
  const errs = formState.errors;

  const onSubmit = handleSubmit((values) =>
    start(async () => {
      setFailure(null);
      const res = await createProtocolAction(values);
      if (res.ok) {
        router.push(`/protocols/${res.data.protocolId}/versions/1`);
        return;
      }
      for (const f of res.fieldErrors) setError(f.path as keyof ProtocolFormInput, { message: f.message });
      setFailure(res.message);
    }),
  );

  const describedBy = (name: keyof ProtocolFormInput) => (errs[name] ? `np-${name}-err` : undefined);
  const fieldError = (name: keyof ProtocolFormInput) =>
    errs[name] ? <p id={`np-${name}-err`} className="field-error">{errs[name]?.message as string}</p> : null;

  return (
    <form onSubmit={onSubmit} className="card max-w-2xl space-y-4" noValidate aria-label="New protocol">
      <div>
        <label htmlFor="np-name" className="label">Name</label>
        <input id="np-name" className="field" {...register('name')} aria-invalid={Boolean(errs.name)} aria-describedby={describedBy('name')} />
        {fieldError('name')}
      </div>
      <div>
        <label htmlFor="np-purpose" className="label">Purpose</label>
        <textarea id="np-purpose" rows={3} className="field" {...register('purpose')} aria-describedby={describedBy('purpose')} />
        {fieldError('purpose')}
      </div>
      <fieldset>
        <legend className="label">Modality</legend>
        <div className="flex gap-4 text-sm">
          {(['optical', 'electrical'] as const).map((m) => (
            <label key={m} className="flex items-center gap-1.5 capitalize">
              <input
                type="radio"
                value={m}
                {...register('modality', {
                  onChange: () => {
                    setValue('rigIds', []);
                    setValue('startFrom', 'example');
                  },
                })}
              />
              {m}
            </label>
          ))}
        </div>
        {fieldError('modality')}
      </fieldset>
      <div>
        <label htmlFor="np-target" className="label">Target</label>
        <input id="np-target" className="field" placeholder="Region and hemisphere, e.g. dorsal CA1, left" {...register('target')} aria-describedby={describedBy('target')} />
        {fieldError('target')}
      </div>
      <fieldset aria-describedby={describedBy('rigIds')}>
        <legend className="label">Rigs it may run on</legend>
        {usable.length === 0 ? (
          <p className="text-sm text-ink-muted">No {modality} rigs in this lab.</p>
        ) : (
          <div className="space-y-1 text-sm">
            {usable.map((r) => (
              <label key={r.id} className="flex items-center gap-2">
                <input type="checkbox" checked={chosen.includes(r.id)} onChange={(e) => toggleRig(r.id, e.target.checked)} />
                {r.name} <span className="text-xs text-ink-muted">({r.clockHz.toLocaleString('en')} Hz clock)</span>
              </label>
            ))}
          </div>
        )}
        <p className="mt-1 text-xs text-ink-muted">
          {chosen.length > 0 ? `Version 1 runs on ${rigs.find((r) => r.id === chosen[0])?.name ?? 'the first one ticked'}; ` : 'The first one ticked carries version 1; '}
          a draft can move to any of them later.
        </p>
        {fieldError('rigIds')}
      </fieldset>
      <div>
        <label htmlFor="np-start" className="label">Start from</label>
        <select id="np-start" className="field" {...register('startFrom')} aria-describedby={describedBy('startFrom')}>
          <option value="example">The example {modality} schedule</option>
          {starts.map((e) => (
            <option key={e.id} value={e.id}>Envelope: {e.name}</option>
          ))}
        </select>
        {fieldError('startFrom')}
      </div>
      {failure ? <p role="alert" className="text-sm text-danger">{failure}</p> : null}
      <button type="submit" className="btn btn-primary" disabled={pending}>{pending ? 'Creating…' : 'Create protocol'}</button>
    </form>
  );
}
