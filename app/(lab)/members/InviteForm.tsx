'use client';

import { useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { inviteSchema, type InviteInput } from '@/lib/auth/schemas';
import { ROLE_LABELS, ROLES } from '@/lib/auth/roles';
import { inviteMember } from './actions';

export function InviteForm() {
  const [pending, start] = useTransition();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, formState, reset, setError } = useForm<InviteInput>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { email: '', roles: ['experimenter'] },
  });
  const onSubmit = handleSubmit((values) =>
    start(async () => {
      const res = await inviteMember(values);
      if (res.ok) {
        setStatus({ ok: true, text: `Invitation sent to ${res.data.email}.` });
        reset();
      } else {
        for (const f of res.fieldErrors) setError(f.path as keyof InviteInput, { message: f.message });
        setStatus({ ok: false, text: res.message });
      }
    }),
  );
  const errs = formState.errors;
  return (
    <form onSubmit={onSubmit} className="card space-y-3" noValidate aria-labelledby="invite-title">
      <h2 id="invite-title" className="text-base">Invite someone</h2>
      <div>
        <label htmlFor="invite-email" className="label">E-mail</label>
        <input id="invite-email" type="email" className="field" {...register('email')}
          aria-invalid={Boolean(errs.email)} aria-describedby={errs.email ? 'invite-email-err' : undefined} />
        {errs.email ? <p id="invite-email-err" className="field-error">{errs.email.message}</p> : null}
      </div>
      <fieldset>
        <legend className="label">Roles</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          {ROLES.map((r) => (
            <label key={r} className="flex items-center gap-1.5">
              <input type="checkbox" value={r} {...register('roles')} /> {ROLE_LABELS[r]}
            </label>
          ))}
        </div>
        {errs.roles ? <p className="field-error">{errs.roles.message}</p> : null}
      </fieldset>
      {status ? <p role="status" className={`text-sm ${status.ok ? 'text-ok' : 'text-danger'}`}>{status.text}</p> : null}
      <button type="submit" className="btn btn-primary" disabled={pending}>{pending ? 'Sending…' : 'Send invitation'}</button>
    </form>
  );
}
