'use client';

import { useEffect, useRef, useState, useTransition } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { tokenCreateSchema, TOKEN_MAX_DAYS, type TokenCreateInput } from '@/lib/rigs/schema';
import { createTokenAction, revokeTokenAction } from '../actions';

export type TokenRow = {
  id: string;
  name: string;
  createdAt: string;
  expiresAt: string;
  lastUsedAt: string | null;
  status: 'active' | 'revoked' | 'expired';
};

const STATUS_STYLE: Record<TokenRow['status'], string> = {
  active: 'bg-ok-soft text-ok',
  revoked: 'bg-danger-soft text-danger',
  expired: 'bg-warn-soft text-warn',
};

const when = (iso: string | null) => (iso ? iso.slice(0, 16).replace('T', ' ') + ' UTC' : '—');

/** Create, list and revoke a rig's tokens. A new secret is shown once, in a dialog. */
export function TokenPanel({ rigId, rigName, tokens, archived }: { rigId: string; rigName: string; tokens: TokenRow[]; archived: boolean }) {
  const [pending, start] = useTransition();
  const [created, setCreated] = useState<{ name: string; secret: string; expiresAt: string } | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState, reset, setError } = useForm<TokenCreateInput>({
    resolver: zodResolver(tokenCreateSchema),
    defaultValues: { rigId, name: '', expiresInDays: 180 },
  });
  const errs = formState.errors;

  const onSubmit = handleSubmit((values) =>
    start(async () => {
      setMessage(null);
      const res = await createTokenAction(values);
      if (res.ok) {
        setCreated(res.data);
        reset({ rigId, name: '', expiresInDays: 180 });
      } else {
        for (const f of res.fieldErrors) setError(f.path as keyof TokenCreateInput, { message: f.message });
        setMessage(res.message);
      }
    }),
  );

  const revoke = (t: TokenRow) => {
    if (!window.confirm(`Revoke “${t.name}”? Rigs using it get 401 from their next request.`)) return;
    start(async () => {
      const res = await revokeTokenAction({ rigId, tokenId: t.id });
      setMessage(res.ok ? `Revoked “${t.name}”.` : res.message);
    });
  };

  return (
    <section className="space-y-4" aria-labelledby="tokens-title">
      <h2 id="tokens-title">Rig tokens</h2>
      <p className="max-w-prose text-sm text-ink-muted">
        The rig PC reads its approved schedules with a token sent as <code className="font-mono">Authorization: Bearer …</code>. A token
        reads only this rig’s approved versions. Its secret is shown once; Pulseloom keeps only a hash of it.
      </p>
      {archived ? (
        <p className="text-sm text-warn">This rig is archived: its tokens are refused until it is restored.</p>
      ) : (
        <form onSubmit={onSubmit} noValidate className="card flex flex-wrap items-end gap-3" aria-label="Create a token">
          <input type="hidden" {...register('rigId')} />
          <div className="min-w-56 flex-1">
            <label htmlFor="token-name" className="label">Token name</label>
            <input id="token-name" className="field" placeholder="e.g. rig PC 2 acquisition" {...register('name')}
              aria-invalid={Boolean(errs.name)} aria-describedby={errs.name ? 'token-name-err' : undefined} />
            {errs.name ? <p id="token-name-err" className="field-error">{errs.name.message}</p> : null}
          </div>
          <div className="w-40">
            <label htmlFor="token-days" className="label">Expires in (days)</label>
            <input id="token-days" type="number" min={1} max={TOKEN_MAX_DAYS} className="field" {...register('expiresInDays', { valueAsNumber: true })}
              aria-invalid={Boolean(errs.expiresInDays)} aria-describedby={errs.expiresInDays ? 'token-days-err' : undefined} />
            {errs.expiresInDays ? <p id="token-days-err" className="field-error">{errs.expiresInDays.message}</p> : null}
          </div>
          <button type="submit" className="btn btn-primary" disabled={pending}>{pending ? 'Creating…' : 'Create token'}</button>
        </form>
      )}
      {message ? <p role="status" className="text-sm text-ink-muted">{message}</p> : null}

      {tokens.length === 0 ? (
        <p className="text-sm text-ink-muted">No tokens yet. Create one for each rig PC, named so you can tell them apart.</p>
      ) : (
        <div className="card overflow-x-auto p-0">
          <table className="table" aria-label={`Tokens of ${rigName}`}>
            <thead>
              <tr><th>Name</th><th>Created</th><th>Expires</th><th>Last used</th><th>Status</th><th><span className="sr-only">Actions</span></th></tr>
            </thead>
            <tbody>
              {tokens.map((t) => (
                <tr key={t.id} data-testid="token-row">
                  <td className="font-medium">{t.name}</td>
                  <td className="font-mono text-xs">{when(t.createdAt)}</td>
                  <td className="font-mono text-xs">{when(t.expiresAt)}</td>
                  <td className="font-mono text-xs">{when(t.lastUsedAt)}</td>
                  <td><span className={`rounded px-2 py-0.5 text-xs font-semibold ${STATUS_STYLE[t.status]}`}>{t.status}</span></td>
                  <td className="text-right">
                    {t.status === 'active' ? (
                      <button type="button" className="btn btn-danger py-1" disabled={pending} onClick={() => revoke(t)} aria-label={`Revoke ${t.name}`}>
                        Revoke
                      </button>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {created ? <SecretDialog created={created} onClose={() => setCreated(null)} /> : null}
    </section>
  );
}

function SecretDialog({ created, onClose }: { created: { name: string; secret: string; expiresAt: string }; onClose: () => void }) {
  const ref = useRef<HTMLDialogElement>(null);
  const [copied, setCopied] = useState<string | null>(null);
  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal();
  }, []);

  const copy = async () => {
    try {
      await navigator.clipboard.writeText(created.secret);
      setCopied('Copied to the clipboard.');
    } catch {
      // Clipboard access can be refused (insecure origin, permissions): select the text instead.
      const field = ref.current?.querySelector('input');
      field?.select();
      setCopied('Selected: press Ctrl+C (⌘C) to copy.');
    }
  };

  return (
    <dialog ref={ref} onClose={onClose} aria-labelledby="secret-title" className="m-auto max-w-lg rounded-card border border-line bg-panel p-6 text-ink backdrop:bg-ink/40">
      <h2 id="secret-title" className="text-base">Token “{created.name}” created</h2>
      <p className="mt-2 text-sm">
        Copy the secret now and put it on the rig PC. <strong>It will not be shown again</strong>; if it is lost, revoke this token and create
        another. It expires {created.expiresAt.slice(0, 10)}.
      </p>
      <label htmlFor="token-secret" className="label mt-4">Secret</label>
      <div className="flex gap-2">
        <input id="token-secret" readOnly value={created.secret} className="field font-mono text-xs" data-testid="token-secret" onFocus={(e) => e.currentTarget.select()} />
        <button type="button" className="btn" onClick={copy}>Copy</button>
      </div>
      <p role="status" className="mt-1 min-h-4 text-xs text-ink-muted">{copied}</p>
      <form method="dialog" className="mt-4 text-right">
        <button type="submit" className="btn btn-primary" autoFocus>I have stored it</button>
      </form>
    </dialog>
  );
}
