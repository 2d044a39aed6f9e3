'use client';

import { useActionState } from 'react';
import { acceptInvitationAction } from './actions';

export function AcceptForm({ token }: { token: string }) {
  const [state, action, pending] = useActionState(acceptInvitationAction, {});
  return (
    <form action={action} className="mt-6 space-y-3 text-left">
      <input type="hidden" name="token" value={token} />
      <div>
        <label htmlFor="invite-name" className="label">Your name (as colleagues know you)</label>
        <input id="invite-name" name="name" className="field" maxLength={120} />
      </div>
      {state.message ? <p role="alert" className="text-sm text-danger">{state.message}</p> : null}
      <button type="submit" className="btn btn-primary w-full justify-center" disabled={pending}>
        {pending ? 'Joining…' : 'Join the lab'}
      </button>
    </form>
  );
}
