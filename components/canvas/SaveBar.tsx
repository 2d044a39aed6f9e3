'use client';
import { useState } from 'react';
import type { Spec, SpecError } from '@/lib/schedule/spec';

export type SaveResult = { ok: true } | { ok: false; errors: { path: string; message: string }[] };

/**
 * Save, with the reasons it is blocked right there. Invalid states never stop editing;
 * they only stop saving.
 */
export function SaveBar({
  spec,
  checking = false,
  blockers,
  readOnly,
  onSave,
}: {
  spec: Spec;
  /** The latest edit has not been validated yet (validation runs deferred). */
  checking?: boolean;
  blockers: readonly SpecError[];
  readOnly?: boolean;
  onSave?: (spec: Spec) => Promise<SaveResult>;
}) {
  const [state, setState] = useState<{ kind: 'idle' } | { kind: 'saving' } | { kind: 'saved'; spec: Spec } | { kind: 'failed'; errors: SpecError[] }>({ kind: 'idle' });
  // The workbench makes a new spec object on every edit, so identity says "unchanged since saving".
  const savedNow = state.kind === 'saved' && state.spec === spec;
  const blocked = blockers.length > 0;

  const save = async () => {
    if (!onSave) return;
    setState({ kind: 'saving' });
    try {
      const r = await onSave(spec);
      setState(r.ok ? { kind: 'saved', spec } : { kind: 'failed', errors: r.errors });
    } catch (err) {
      setState({ kind: 'failed', errors: [{ path: '$', message: err instanceof Error ? err.message : 'Saving failed.' }] });
    }
  };

  return (
    <div className="card flex flex-wrap items-start gap-4 py-3">
      <p className="text-sm">
        <span className="text-ink-muted">Seed in use </span>
        <span className="font-mono">{spec.seed || '—'}</span>
      </p>
      {!readOnly && onSave ? (
        <div className="ml-auto flex flex-col items-end gap-1">
          <button type="button" className="btn btn-primary" disabled={blocked || checking || state.kind === 'saving'} aria-describedby={blocked ? 'save-blockers' : undefined} onClick={save}>
            {state.kind === 'saving' ? 'Saving…' : 'Save'}
          </button>
          <p className="text-xs" role="status" aria-live="polite">
            {savedNow ? <span className="text-ok">Saved.</span> : null}
          </p>
        </div>
      ) : readOnly ? (
        <p className="ml-auto text-sm text-ink-muted">Read-only</p>
      ) : null}
      {blocked && !readOnly ? (
        <div id="save-blockers" className="w-full text-sm">
          <p className="font-semibold text-warn">Saving is blocked until these are fixed:</p>
          <ul className="mt-1 space-y-0.5">
            {blockers.slice(0, 8).map((b) => (
              <li key={`${b.path}:${b.message}`}>
                <span className="font-mono text-xs text-ink-muted">{b.path}</span> {b.message}
              </li>
            ))}
            {blockers.length > 8 ? <li className="text-ink-muted">… and {blockers.length - 8} more.</li> : null}
          </ul>
        </div>
      ) : null}
      {state.kind === 'failed' ? (
        <div className="w-full rounded-md border border-danger bg-danger-soft p-2 text-sm" role="alert">
          <p className="font-semibold text-danger">Not saved:</p>
          <ul>
            {state.errors.map((e) => (
              <li key={`${e.path}:${e.message}`}>
                <span className="font-mono text-xs">{e.path}</span> {e.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
