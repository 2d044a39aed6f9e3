'use client';

import { useState, useTransition } from 'react';
import { ROLE_LABELS, ROLES, type Role } from '@/lib/auth/roles';
import { setMemberRoles } from './actions';

export function RoleEditor({ userId, roles, label }: { userId: string; roles: Role[]; label: string }) {
  const [value, setValue] = useState<Role[]>(roles);
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const dirty = value.slice().sort().join() !== roles.slice().sort().join();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <fieldset className="flex flex-wrap gap-3 text-sm" aria-label={`Roles of ${label}`}>
        {ROLES.map((r) => (
          <label key={r} className="flex items-center gap-1">
            <input
              type="checkbox"
              checked={value.includes(r)}
              onChange={(e) => setValue(e.target.checked ? [...value, r] : value.filter((x) => x !== r))}
            />
            {ROLE_LABELS[r]}
          </label>
        ))}
      </fieldset>
      <button
        type="button"
        className="btn py-1"
        disabled={!dirty || pending}
        onClick={() =>
          start(async () => {
            const res = await setMemberRoles({ userId, roles: value });
            setMessage(res.ok ? 'Saved.' : res.fieldErrors[0]?.message ?? res.message);
          })
        }
      >
        Save
      </button>
      {message ? <span role="status" className="text-xs text-ink-muted">{message}</span> : null}
    </div>
  );
}
