'use client';
import { useEffect, useId, useRef, useState } from 'react';
import type { Spec } from '@/lib/schedule/spec';
import { envelopeDuration } from '@/lib/schedule/envelope';
import { CSV_LIMITS, formatBytes, parseEnvelopeCsv, pointsToEnvelope, type LeadIn, type ParseCsvResult } from '@/lib/envelope-io';

export interface EnvelopeImportDialogProps {
  open: boolean;
  onClose: () => void;
  /** Called only after the user confirms; the workbench records it as one undoable edit. */
  onReplace: (envelope: Spec['envelope']) => void;
}

type State =
  | { step: 'choose' }
  | { step: 'reading'; name: string }
  | { step: 'refused'; name: string; reason: string }
  | { step: 'read'; name: string; result: ParseCsvResult };

/**
 * Upload a rate trace as CSV. Nothing changes until the user has seen the report (bad
 * lines with their numbers, or how far simplification moved the trace) and confirmed.
 */
export function EnvelopeImportDialog({ open, onClose, onReplace }: EnvelopeImportDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const [state, setState] = useState<State>({ step: 'choose' });
  const [leadIn, setLeadIn] = useState<LeadIn>('shift');

  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) {
      setState({ step: 'choose' });
      d.showModal();
    } else if (!open && d.open) d.close();
  }, [open]);

  const readFile = async (file: File) => {
    // Refuse before reading: a huge file should not be pulled into memory at all.
    if (file.size > CSV_LIMITS.maxBytes) {
      setState({ step: 'refused', name: file.name, reason: `The file is ${formatBytes(file.size)}; the limit is ${formatBytes(CSV_LIMITS.maxBytes)}.` });
      return;
    }
    setState({ step: 'reading', name: file.name });
    const text = await file.text();
    // Yield a frame so "Reading…" shows before a long parse and simplification.
    await new Promise((r) => setTimeout(r, 16));
    setState({ step: 'read', name: file.name, result: parseEnvelopeCsv(text) });
  };

  const result = state.step === 'read' ? state.result : null;
  const startsLate = result?.ok && result.points[0].t > 0 ? result.points[0].t : 0;
  const envelope = result?.ok ? pointsToEnvelope(result.points, leadIn) : null;

  return (
    <dialog ref={ref} aria-labelledby={titleId} onClose={onClose} className="m-auto w-[min(40rem,95vw)] rounded-card border border-line bg-panel p-5 text-ink backdrop:bg-ink/30">
      <h2 id={titleId}>Import an envelope from CSV</h2>
      <p className="mt-2 text-sm text-ink-muted">
        Rows of <span className="font-mono">time_s,rate_hz</span>; a header row is optional; fields separated by commas or semicolons; decimal point (not comma). Up to{' '}
        {formatBytes(CSV_LIMITS.maxBytes)} and {CSV_LIMITS.maxRows.toLocaleString('en-US')} rows. A time may repeat once to mark a step. Traces with more than{' '}
        {CSV_LIMITS.maxPoints.toLocaleString('en-US')} breakpoints are simplified, and the largest rate difference is reported.
      </p>

      <label className="mt-4 block">
        <span className="label">CSV file</span>
        <input
          type="file"
          accept=".csv,text/csv,text/plain"
          className="block text-sm"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void readFile(f);
          }}
        />
      </label>

      <div className="mt-4 space-y-3 text-sm" aria-live="polite">
        {state.step === 'reading' ? <p>Reading {state.name}…</p> : null}
        {state.step === 'refused' ? <p className="text-danger">{state.reason}</p> : null}
        {result && !result.ok ? (
          <div>
            <p className="font-semibold text-danger">
              {state.step === 'read' ? state.name : ''} cannot be used as it is. Fix these rows and upload it again:
            </p>
            <ul className="mt-2 max-h-56 overflow-auto rounded-md border border-line bg-danger-soft p-2 font-mono text-xs">
              {result.errors.map((e, i) => (
                <li key={i}>{e.line > 0 ? `line ${e.line}: ${e.reason}` : e.reason}</li>
              ))}
              {result.moreErrors > 0 ? <li>… and {result.moreErrors} more bad rows.</li> : null}
            </ul>
          </div>
        ) : null}
        {result?.ok && envelope ? (
          <div className="space-y-2">
            <p>
              Read <span className="font-mono">{result.dataRows}</span> rows{result.hasHeader ? ' after a header row' : ''}, separated by “{result.delimiter}”.
            </p>
            {result.simplified.from > result.simplified.to ? (
              <p className="rounded-md border border-warn bg-warn-soft p-2">
                Simplified from <span className="font-mono">{result.simplified.from}</span> to <span className="font-mono">{result.simplified.to}</span> breakpoints (Ramer–Douglas–Peucker). The
                largest rate difference from the file is <span className="font-mono">{result.simplified.maxRateErrorHz.toFixed(3)} Hz</span>.
              </p>
            ) : (
              <p>All {result.simplified.to} breakpoints kept; no simplification needed.</p>
            )}
            {startsLate > 0 ? (
              <fieldset className="space-y-1">
                <legend>
                  The trace starts at <span className="font-mono">{startsLate} s</span>; an envelope starts at 0 s.
                </legend>
                <label className="flex items-center gap-2">
                  <input type="radio" name="lead-in" checked={leadIn === 'shift'} onChange={() => setLeadIn('shift')} /> Move the trace to start at 0 s
                </label>
                <label className="flex items-center gap-2">
                  <input type="radio" name="lead-in" checked={leadIn === 'hold'} onChange={() => setLeadIn('hold')} /> Keep its times; hold its first rate from 0 s
                </label>
              </fieldset>
            ) : null}
            <p>
              The new envelope: <span className="font-mono">{envelope.length}</span> segments over <span className="font-mono">{envelopeDuration(envelope).toFixed(3)} s</span>. It replaces
              the current one; Undo brings the old one back.
            </p>
          </div>
        ) : null}
      </div>

      <div className="mt-5 flex justify-end gap-2">
        <button type="button" className="btn" onClick={onClose}>
          Cancel
        </button>
        <button
          type="button"
          className="btn btn-primary"
          disabled={!envelope || envelope.length === 0}
          onClick={() => {
            if (envelope) onReplace(envelope);
            onClose();
          }}
        >
          Replace the envelope
        </button>
      </div>
    </dialog>
  );
}
