'use client';

import { useActionState } from 'react';
import { signInWithEmailLink, signInWithPassword, type SignInState } from './actions';

function fieldError(state: SignInState, name: string) {
  return state.fieldErrors?.find((e) => e.path === name)?.message;
}

export function PasswordForm({ next }: { next: string }) {
  const [state, action, pending] = useActionState(signInWithPassword, {});
  const emailErr = fieldError(state, 'email');
  const pwErr = fieldError(state, 'password');
  return (
    <form action={action} className="space-y-3" noValidate>
      <input type="hidden" name="next" value={next} />
      <div>
        <label htmlFor="pw-email" className="label">E-mail</label>
        <input id="pw-email" name="email" type="email" autoComplete="username" className="field" defaultValue={state.email}
          aria-invalid={Boolean(emailErr)} aria-describedby={emailErr ? 'pw-email-err' : undefined} />
        {emailErr ? <p id="pw-email-err" className="field-error">{emailErr}</p> : null}
      </div>
      <div>
        <label htmlFor="pw-password" className="label">Password</label>
        <input id="pw-password" name="password" type="password" autoComplete="current-password" className="field"
          aria-invalid={Boolean(pwErr)} aria-describedby={pwErr ? 'pw-password-err' : undefined} />
        {pwErr ? <p id="pw-password-err" className="field-error">{pwErr}</p> : null}
      </div>
      {state.message ? <p role="alert" className="rounded-md bg-danger-soft px-3 py-2 text-sm text-danger">{state.message}</p> : null}
      <button type="submit" className="btn btn-primary w-full justify-center" disabled={pending}>
        {pending ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}

export function EmailLinkForm({ next }: { next: string }) {
  const [state, action, pending] = useActionState(signInWithEmailLink, {});
  const emailErr = fieldError(state, 'email');
  return (
    <form action={action} className="space-y-3" noValidate>
      <input type="hidden" name="next" value={next} />
      <div>
        <label htmlFor="link-email" className="label">E-mail</label>
        <input id="link-email" name="email" type="email" autoComplete="email" className="field"
          aria-invalid={Boolean(emailErr)} aria-describedby={emailErr ? 'link-email-err' : undefined} />
        {emailErr ? <p id="link-email-err" className="field-error">{emailErr}</p> : null}
      </div>
      {state.message ? <p role="alert" className="text-sm text-danger">{state.message}</p> : null}
      <button type="submit" className="btn w-full justify-center" disabled={pending}>
        {pending ? 'Sending…' : 'E-mail me a sign-in link'}
      </button>
    </form>
  );
}
