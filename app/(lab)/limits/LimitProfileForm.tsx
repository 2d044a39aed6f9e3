'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { get, useForm, type FieldErrors, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { demoProfileFor, limitProfileSchema, type LimitProfile } from '@/lib/safety';
import type { Modality } from '@/lib/schedule/spec';
import { createLimitProfileAction, updateLimitProfileAction } from './actions';
import { MODALITY_LABEL, WINDOW_FIELD, limitFieldsFor, type LimitField } from './fields';
import { fromForm, numberOrUndefined, toForm, type LimitFormValues } from './form-values';

type Props = {
  modality: Modality;
  rigs: { id: string; name: string }[];
  /** Editing an existing profile: its id, its limits and when it was last saved. */
  existing?: { id: string; profile: LimitProfile; updatedAt: string };
};

const schemaResolver = zodResolver(limitProfileSchema);

export function LimitProfileForm({ modality, rigs, existing }: Props) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [loadedAt, setLoadedAt] = useState(existing?.updatedAt ?? '');

  // The shared schema checks what the server will check; the form only turns empty
  // boxes into "not set" first.
  const resolver: Resolver<LimitFormValues, unknown, LimitProfile> = async (values, ctx, options) => {
    const result = await schemaResolver(fromForm(values, modality) as never, ctx, options as never);
    const seconds = get(result.errors, 'limits.window.seconds') as { message?: string } | undefined;
    if (seconds && values.limits.window?.seconds === undefined) seconds.message = 'Give the window length in seconds.';
    return result as unknown as Awaited<ReturnType<Resolver<LimitFormValues, unknown, LimitProfile>>>;
  };

  const { register, handleSubmit, formState, setError, reset, getValues } = useForm<LimitFormValues, unknown, LimitProfile>({
    resolver,
    defaultValues: toForm(existing?.profile ?? null),
  });
  const errors = formState.errors as FieldErrors<LimitFormValues>;

  const showFieldErrors = (res: { message: string; fieldErrors: { path: string; message: string }[] }) => {
    for (const f of res.fieldErrors) setError(f.path.replace(/^profile\./, '') as never, { message: f.message });
    setStatus({ ok: false, text: res.message });
  };

  const onSubmit = handleSubmit((profile) =>
    start(async () => {
      setStatus(null);
      if (existing) {
        const res = await updateLimitProfileAction({ id: existing.id, loadedAt, profile });
        if (!res.ok) return showFieldErrors(res);
        setLoadedAt(res.data.updatedAt);
        reset(toForm(profile));
        setStatus({ ok: true, text: 'Saved. New safety sheets use these limits.' });
        router.refresh();
      } else {
        const res = await createLimitProfileAction(profile);
        if (!res.ok) return showFieldErrors(res);
        router.push('/limits');
      }
    }),
  );

  // Demo values are starting points, not recommendations; a typed name is kept.
  const fillDemo = () => {
    const demo = demoProfileFor(modality);
    reset({ ...toForm(demo), rigId: getValues('rigId'), name: getValues('name') || demo.name });
  };

  const fields = limitFieldsFor(modality);
  const err = (path: string): string | undefined => (get(errors, path) as { message?: string } | undefined)?.message;
  const numberBox = (path: string, label: string, opts: { signed?: boolean; integer?: boolean } = {}) => {
    const id = `f-${path.replace(/\./g, '-')}`;
    const message = err(path);
    return (
      <div>
        <label htmlFor={id} className="sr-only">{label}</label>
        <input
          id={id}
          type="number"
          inputMode="decimal"
          step={opts.integer ? 1 : 'any'}
          min={opts.signed ? undefined : 0}
          className="field w-28 font-mono"
          aria-invalid={Boolean(message)}
          aria-describedby={message ? `${id}-err` : undefined}
          {...register(path as never, { setValueAs: numberOrUndefined })}
        />
        {message ? <p id={`${id}-err`} className="field-error max-w-40">{message}</p> : null}
      </div>
    );
  };

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6" aria-label={`${MODALITY_LABEL[modality]} limit profile`}>
      <div className="card grid gap-4 md:grid-cols-3">
        <div>
          <label htmlFor="f-name" className="label">Name</label>
          <input id="f-name" className="field" {...register('name')} aria-invalid={Boolean(err('name'))}
            aria-describedby={err('name') ? 'f-name-err' : undefined} />
          {err('name') ? <p id="f-name-err" className="field-error">{err('name')}</p> : null}
        </div>
        <div>
          <label htmlFor="f-rig" className="label">Applies to</label>
          <select id="f-rig" className="field" {...register('rigId')} aria-describedby="f-rig-hint">
            <option value="">Every {modality} rig in the lab</option>
            {rigs.map((r) => (
              <option key={r.id} value={r.id}>Only {r.name}</option>
            ))}
          </select>
          <p id="f-rig-hint" className="mt-1 text-xs text-ink-muted">A rig’s own profile takes precedence over the lab’s.</p>
          {err('rigId') ? <p className="field-error">{err('rigId')}</p> : null}
        </div>
        <div>
          <label htmlFor="f-unknown" className="label">When a value cannot be computed</label>
          <select id="f-unknown" className="field" {...register('whenUnknown')} aria-describedby="f-unknown-hint">
            <option value="warn">Ask for a justification</option>
            <option value="fail">Block submission</option>
          </select>
          <p id="f-unknown-hint" className="mt-1 text-xs text-ink-muted">
            For example when the rig record lacks its fibre core or electrode area.
          </p>
        </div>
      </div>

      <div className="card overflow-x-auto p-0">
        <table className="table">
          <caption className="px-3 pt-3 text-left text-sm text-ink-muted">
            Beyond the hard limit a version cannot be submitted; beyond the warning level it needs a written
            justification. Leave both empty to leave a metric unchecked.
          </caption>
          <thead>
            <tr>
              <th scope="col">Metric</th>
              <th scope="col">Warning level</th>
              <th scope="col">Hard limit</th>
              <th scope="col">Unit</th>
            </tr>
          </thead>
          <tbody>
            {fields.map((f) => (
              <LimitRow key={f.key} field={f}>
                {numberBox(`limits.${f.key}.warn`, `${f.label}, warning level`, f)}
                {numberBox(`limits.${f.key}.hard`, `${f.label}, hard limit`, f)}
              </LimitRow>
            ))}
            <tr>
              <th scope="row" className="border-line/60 text-left text-sm font-normal normal-case tracking-normal text-ink">
                <div className="font-medium">{WINDOW_FIELD.label}</div>
                <div className="mt-1 flex items-center gap-2 text-xs text-ink-muted">
                  <span>window of</span>
                  {numberBox('limits.window.seconds', 'Window length in seconds')}
                  <span>s</span>
                </div>
              </th>
              <td>{numberBox('limits.window.maxPulses.warn', 'Pulses in the window, warning level', { integer: true })}</td>
              <td>{numberBox('limits.window.maxPulses.hard', 'Pulses in the window, hard limit', { integer: true })}</td>
              <td className="text-ink-muted">≤ pulses</td>
            </tr>
          </tbody>
        </table>
      </div>

      {status ? (
        <p role="status" className={`text-sm ${status.ok ? 'text-ok' : 'text-danger'}`} data-testid="limits-status">
          {status.text}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn btn-primary" disabled={pending}>
          {pending ? 'Saving…' : existing ? 'Save limits' : 'Create profile'}
        </button>
        {!existing ? (
          <button type="button" className="btn" onClick={fillDemo} disabled={pending}>
            Fill in demo values
          </button>
        ) : null}
        <Link href="/limits" className="btn">Back to profiles</Link>
      </div>
    </form>
  );
}

function LimitRow({ field, children }: { field: LimitField; children: React.ReactNode }) {
  return (
    <tr>
      <th scope="row" className="border-line/60 text-left text-sm font-normal normal-case tracking-normal text-ink">
        <div className="font-medium">{field.label}</div>
        {field.hint ? <div className="mt-0.5 max-w-md text-xs text-ink-muted">{field.hint}</div> : null}
      </th>
      {Array.isArray(children) ? children.map((c, i) => <td key={i}>{c}</td>) : <td>{children}</td>}
      <td className="whitespace-nowrap text-ink-muted">
        {field.direction === 'min' ? '≥' : '≤'} {field.unit || '(no unit)'}
      </td>
    </tr>
  );
}
