'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { useForm, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { rigSchema, type RigInput, type RigValues } from '@/lib/rigs/schema';
import { createRigAction, updateRigAction } from './actions';

type Props = { rigId?: string; initial?: RigInput; modalityLocked?: string | null };

const BLANK: RigInput = { modality: 'optical', name: '', clockHz: 10_000, channels: 1, notes: '', wavelengthNm: NaN, fibreCoreUm: NaN, fibreNA: NaN };

/** Register or edit a rig. The fields follow the modality; the same schema checks them on the server. */
export function RigForm({ rigId, initial, modalityLocked }: Props) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, watch, formState, setError } = useForm<RigInput, unknown, RigValues>({
    resolver: zodResolver(rigSchema),
    defaultValues: initial ?? BLANK,
    shouldUnregister: true,
  });
  const modality = watch('modality');
  const errs = formState.errors as FieldErrors<Record<string, unknown>>;

  const onSubmit = handleSubmit((values) =>
    start(async () => {
      setMessage(null);
      const res = rigId ? await updateRigAction({ ...values, rigId }) : await createRigAction(values);
      if (res.ok) {
        router.push(`/rigs/${res.data.rigId}`);
        router.refresh();
        return;
      }
      for (const f of res.fieldErrors) setError(f.path as keyof RigInput, { message: f.message });
      setMessage(res.message);
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-2xl space-y-4" aria-label={rigId ? 'Edit rig' : 'Register a rig'}>
      <Field name="name" label="Name" register={register} errors={errs} type="text" />
      <fieldset>
        <legend className="label">Modality</legend>
        <div className="flex gap-4 text-sm">
          {(['optical', 'electrical'] as const).map((m) => (
            <label key={m} className="flex items-center gap-1.5">
              <input type="radio" value={m} {...register('modality')} disabled={Boolean(modalityLocked) && m !== initial?.modality} />
              {m === 'optical' ? 'Optical (light)' : 'Electrical (current)'}
            </label>
          ))}
        </div>
        {modalityLocked ? <p className="mt-1 text-xs text-ink-muted">{modalityLocked}</p> : null}
        {errs.modality ? <p className="field-error">{String(errs.modality.message)}</p> : null}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field name="clockHz" label="Output sample clock" unit="Hz" register={register} errors={errs} hint="Every schedule made for this rig is placed on this clock." />
        <Field name="channels" label="Output channels" register={register} errors={errs} />
      </div>
      {modality === 'optical' ? (
        <div className="grid gap-4 sm:grid-cols-3">
          <Field name="wavelengthNm" label="Wavelength" unit="nm" register={register} errors={errs} step="any" />
          <Field name="fibreCoreUm" label="Fibre core diameter" unit="µm" register={register} errors={errs} step="any" />
          <Field name="fibreNA" label="Fibre NA" register={register} errors={errs} step="any" />
        </div>
      ) : (
        <div className="grid gap-4 sm:grid-cols-2">
          <Field name="electrodeMaterial" label="Electrode material" register={register} errors={errs} type="text" />
          <Field name="electrodeAreaMm2" label="Geometric area" unit="mm²" register={register} errors={errs} step="any" />
        </div>
      )}
      <div>
        <label htmlFor="rig-notes" className="label">Notes</label>
        <textarea id="rig-notes" rows={3} className="field" {...register('notes')} />
      </div>
      {message ? <p role="alert" className="text-sm text-danger">{message}</p> : null}
      <div className="flex gap-2">
        <button type="submit" className="btn btn-primary" disabled={pending}>
          {pending ? 'Saving…' : rigId ? 'Save rig' : 'Register rig'}
        </button>
        <button type="button" className="btn" onClick={() => router.back()}>Cancel</button>
      </div>
    </form>
  );
}

function Field({
  name,
  label,
  register,
  errors,
  type = 'number',
  step,
  hint,
  unit,
}: {
  name: string;
  label: string;
  /** Shown in its own case: the label style capitalises, and µm must not read as MM. */
  unit?: string;
  register: UseFormRegister<RigInput>;
  errors: FieldErrors<Record<string, unknown>>;
  type?: 'number' | 'text';
  step?: string;
  hint?: string;
}) {
  const id = `rig-${name}`;
  const err = errors[name]?.message;
  const described = [hint ? `${id}-hint` : null, err ? `${id}-err` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
        {unit ? <span className="normal-case"> ({unit})</span> : null}
      </label>
      <input
        id={id}
        type={type}
        step={step}
        inputMode={type === 'number' ? 'decimal' : undefined}
        className="field"
        aria-invalid={Boolean(err)}
        aria-describedby={described}
        {...register(name as keyof RigInput, type === 'number' ? { valueAsNumber: true } : {})}
      />
      {hint ? <p id={`${id}-hint`} className="mt-1 text-xs text-ink-muted">{hint}</p> : null}
      {err ? <p id={`${id}-err`} className="field-error">{String(err)}</p> : null}
    </div>
  );
}
