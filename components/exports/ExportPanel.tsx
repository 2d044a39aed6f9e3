'use client';

import { useEffect, useId, useState, useTransition } from 'react';
import { SAFETY_DISCLAIMER, cautionsFor } from '@/lib/safety/cautions';
import type { VersionStatus } from '@/db/schema/protocols';
import { acknowledgeExportCautions } from './actions';

type Props = { versionId: string; status: VersionStatus; modality: 'optical' | 'electrical' };
type AckState = { kind: 'loading' } | { kind: 'needed' } | { kind: 'done'; at: string } | { kind: 'error'; message: string };

const PREVIEW_LABEL = 'PREVIEW — NOT APPROVED FOR USE';

/**
 * Schedule downloads for one version. The cautions come first; the download links appear
 * only after the person acknowledges them, once per version (the server checks it too).
 */
export function ExportPanel({ versionId, status, modality }: Props) {
  const ids = useId();
  const [ack, setAck] = useState<AckState>({ kind: 'loading' });
  const [checked, setChecked] = useState(false);
  const [pending, start] = useTransition();
  const approved = status === 'approved';
  const cautions = cautionsFor(modality);
  const disclaimerShown = cautions.some((c) => c.body === SAFETY_DISCLAIMER);

  useEffect(() => {
    let live = true;
    fetch(`/api/versions/${versionId}/export/acknowledgement`, { cache: 'no-store' })
      .then(async (res) => {
        const body = (await res.json().catch(() => null)) as { acknowledgedAt?: string | null; error?: { message?: string } } | null;
        if (!live) return;
        if (!res.ok) setAck({ kind: 'error', message: body?.error?.message ?? `The server answered ${res.status}.` });
        else setAck(body?.acknowledgedAt ? { kind: 'done', at: body.acknowledgedAt } : { kind: 'needed' });
      })
      .catch(() => live && setAck({ kind: 'error', message: 'Could not reach the server.' }));
    return () => {
      live = false;
    };
  }, [versionId]);

  const acknowledge = () =>
    start(async () => {
      const res = await acknowledgeExportCautions({ versionId });
      setAck(res.ok ? { kind: 'done', at: res.data.acknowledgedAt } : { kind: 'error', message: res.fieldErrors[0]?.message ?? res.message });
    });

  const href = (format: 'csv' | 'json') => `/api/versions/${versionId}/export?format=${format}`;
  const done = ack.kind === 'done';

  return (
    <section className="card space-y-4" aria-labelledby={`${ids}-title`} data-testid="export-panel">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={`${ids}-title`} className="text-base">Export schedule</h2>
        {approved ? (
          <span className="rounded bg-ok-soft px-2 py-0.5 text-xs font-semibold text-ok">Approved: same file the rig fetches</span>
        ) : (
          <span className="rounded bg-warn-soft px-2 py-0.5 text-xs font-semibold text-warn" data-testid="preview-label">{PREVIEW_LABEL}</span>
        )}
      </div>
      {!approved ? (
        <p className="text-sm text-ink-muted">
          This version is not approved, so its files are previews: the file name starts with <code className="font-mono">PREVIEW_</code> and
          the file itself says {PREVIEW_LABEL}. Rigs can never fetch it.
        </p>
      ) : null}

      <details open={!done} className="rounded-md border border-line p-3">
        <summary className="cursor-pointer text-sm font-semibold">Cautions before any export</summary>
        <ul className="mt-3 space-y-3 text-sm">
          {cautions.map((c) => (
            <li key={c.id}>
              <p className="font-semibold">{c.title}</p>
              <p className="text-ink">{c.body}</p>
              <p className="mt-0.5 text-xs text-ink-muted">Sources: {c.sources.join('; ')}</p>
            </li>
          ))}
          {disclaimerShown ? null : <li className="text-ink-muted">{SAFETY_DISCLAIMER}</li>}
        </ul>
      </details>

      <div aria-live="polite">
        {ack.kind === 'loading' ? <p className="text-sm text-ink-muted">Checking your acknowledgement…</p> : null}
        {ack.kind === 'error' ? <p role="alert" className="text-sm text-danger">{ack.message}</p> : null}
        {ack.kind === 'needed' ? (
          <div className="space-y-3">
            <label className="flex items-start gap-2 text-sm">
              <input type="checkbox" className="mt-1" checked={checked} onChange={(e) => setChecked(e.target.checked)} />
              <span>
                I have read these cautions. I will check the schedule against the institution’s approved protocol and measure the
                rig’s output before use.
              </span>
            </label>
            <button type="button" className="btn btn-primary" disabled={!checked || pending} onClick={acknowledge}>
              {pending ? 'Recording…' : 'I acknowledge'}
            </button>
          </div>
        ) : null}
        {done ? (
          <div className="space-y-2">
            <p className="text-xs text-ink-muted">Cautions acknowledged {new Date(ack.at).toLocaleString('en-GB')}.</p>
            <div className="flex flex-wrap gap-2">
              <a className="btn" href={href('csv')} download>
                {approved ? 'Download CSV' : 'Download preview CSV'}
              </a>
              <a className="btn" href={href('json')} download>
                {approved ? 'Download JSON' : 'Download preview JSON'}
              </a>
            </div>
            <p className="text-xs text-ink-muted">
              Check any file with <code className="font-mono">npx pulseloom verify &lt;file&gt;</code>.
            </p>
          </div>
        ) : null}
      </div>
    </section>
  );
}
