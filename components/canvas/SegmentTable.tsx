'use client';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm, type FieldErrors } from 'react-hook-form';
import { z } from 'zod';
import { segmentSchema, type Segment, type SpecError } from '@/lib/schedule/spec';
import {
  boundaries,
  convertSegment,
  firstSelectedSegment,
  insertSegmentAfter,
  knotsAt,
  removeSegment,
  select,
  updateSegments,
  type DocIssue,
  type EditorDoc,
} from './model';

export const TABLE_PAGE_ROWS = 20;

/** The table validates with the engine's own segment schema. */
const pageSchema = z.object({ rows: z.array(segmentSchema) });
type PageValues = z.infer<typeof pageSchema>;

export interface SegmentTableProps {
  doc: EditorDoc;
  issues: readonly DocIssue[];
  readOnly?: boolean;
  onEdit: (doc: EditorDoc, tag?: string) => void;
  onSelect: (doc: EditorDoc) => void;
  /** Cells whose text does not pass the schema yet (the doc keeps the last valid value): saving waits for them. */
  onPendingErrors?: (errors: SpecError[]) => void;
}

const SINE_FIELDS = [
  ['meanHz', 'mean (Hz)'],
  ['depthHz', 'depth (Hz)'],
  ['freqHz', 'frequency (Hz)'],
  ['phaseDeg', 'phase (°)'],
] as const;
const RAMP_FIELDS = [
  ['fromHz', 'from (Hz)'],
  ['toHz', 'to (Hz)'],
] as const;

/**
 * The envelope as numbers, one row per segment, a page at a time (a 5,000-segment
 * envelope would make a form of 30,000 inputs). Edits that pass the segment schema are
 * written to the doc at once, through the same model functions the canvas uses; canvas
 * edits come back in through `values`, so each side always shows the other's changes.
 */
export function SegmentTable({ doc, issues, readOnly, onEdit, onSelect, onPendingErrors }: SegmentTableProps) {
  const n = doc.segments.length;
  const pages = Math.max(1, Math.ceil(n / TABLE_PAGE_ROWS));
  const [page, setPage] = useState(0);
  const from = Math.min(page, pages - 1) * TABLE_PAGE_ROWS;
  const rows = useMemo(() => doc.segments.slice(from, from + TABLE_PAGE_ROWS), [doc.segments, from]);
  const starts = useMemo(() => boundaries(doc.segments), [doc.segments]);

  // Follow the selection made on the canvas.
  const firstSel = firstSelectedSegment(doc);
  useEffect(() => {
    if (firstSel !== null) setPage(Math.floor(firstSel / TABLE_PAGE_ROWS));
  }, [firstSel]);

  const form = useForm<PageValues>({
    resolver: zodResolver(pageSchema),
    mode: 'onChange',
    values: { rows: rows as Segment[] },
    resetOptions: { keepDirtyValues: false },
  });
  const { register, formState, watch } = form;

  const latest = useRef({ doc, from, onEdit });
  latest.current = { doc, from, onEdit };
  useEffect(() => {
    const sub = watch((values, { name, type }) => {
      if (type !== 'change' || !name) return;
      const parsed = pageSchema.safeParse(values);
      if (!parsed.success) return;
      const { doc: d, from: f, onEdit: edit } = latest.current;
      const next = updateSegments(d, f, parsed.data.rows);
      // One undo step per cell being typed into.
      if (next !== d) edit(next, `table-${f}-${name}`);
    });
    return () => sub.unsubscribe();
  }, [watch]);

  // Report typed-but-invalid cells upward, keyed by text so an unchanged list does not re-render the workbench.
  const pending: SpecError[] = [];
  formState.errors.rows?.forEach?.((row, k) => {
    if (!row) return;
    for (const [field, err] of Object.entries(row)) {
      const message = (err as { message?: string } | undefined)?.message;
      if (message) pending.push({ path: `envelope[${from + k}].${field}`, message: `${message} (typed in the table, not applied yet)` });
    }
  });
  const pendingKey = JSON.stringify(pending);
  const report = useRef(onPendingErrors);
  report.current = onPendingErrors;
  useEffect(() => {
    report.current?.(JSON.parse(pendingKey) as SpecError[]);
  }, [pendingKey]);

  const rowIssues = useMemo(() => {
    const map = new Map<number, string[]>();
    for (const i of issues) {
      const m = /^envelope\[(\d+)\]/.exec(i.path);
      if (!m) continue;
      const idx = Number(m[1]);
      map.set(idx, [...(map.get(idx) ?? []), i.message]);
    }
    return map;
  }, [issues]);

  const selected = new Set(doc.selection);
  const rowSelected = (i: number) => knotsAt(doc.segments, i, starts[i]).some((k) => k.side !== 'in' && selected.has(k.key)) || knotsAt(doc.segments, i + 1, starts[i + 1]).some((k) => k.side !== 'out' && selected.has(k.key));

  const selectRow = (i: number) => {
    const keys = [...knotsAt(doc.segments, i, starts[i]).filter((k) => k.side !== 'in'), ...knotsAt(doc.segments, i + 1, starts[i + 1]).filter((k) => k.side !== 'out')].map((k) => k.key);
    onSelect(select(doc, keys));
  };

  const errorsFor = (k: number) => (formState.errors.rows?.[k] ?? {}) as FieldErrors<Record<string, number>>;

  return (
    <div>
      <div className="overflow-x-auto">
        <table className="table font-mono text-xs">
          <caption className="sr-only">Envelope segments {from + 1} to {Math.min(n, from + TABLE_PAGE_ROWS)} of {n}</caption>
          <thead>
            <tr>
              <th scope="col">#</th>
              <th scope="col">start (s)</th>
              <th scope="col">kind</th>
              <th scope="col">duration (s)</th>
              <th scope="col">values</th>
              <th scope="col">
                <span className="sr-only">actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((seg, k) => {
              const i = from + k;
              const errs = errorsFor(k);
              const probs = rowIssues.get(i);
              const fields = seg.kind === 'ramp' ? RAMP_FIELDS : SINE_FIELDS;
              return (
                <tr key={i} className={rowSelected(i) ? 'bg-accent-soft' : probs ? 'bg-danger-soft' : undefined}>
                  <td>
                    <button type="button" className="underline decoration-dotted" onClick={() => selectRow(i)} aria-label={`Select segment ${i + 1} on the canvas`}>
                      {i + 1}
                    </button>
                  </td>
                  <td className="text-ink-muted">{starts[i].toFixed(3)}</td>
                  <td>
                    <select
                      className="field w-auto py-0.5 text-xs"
                      aria-label={`Segment ${i + 1} kind`}
                      value={seg.kind}
                      disabled={readOnly}
                      onChange={(e) => onEdit(updateSegments(doc, i, [convertSegment(seg, e.target.value as Segment['kind'])]))}
                    >
                      <option value="ramp">ramp / hold</option>
                      <option value="sine">sine</option>
                    </select>
                  </td>
                  <td>
                    <NumberCell label={`Segment ${i + 1} duration (s)`} error={errs.durationS?.message} readOnly={readOnly} {...register(`rows.${k}.durationS`, { valueAsNumber: true })} />
                  </td>
                  <td>
                    <div className="flex flex-wrap gap-2">
                      {fields.map(([f, label]) => (
                        <label key={f} className="flex items-center gap-1">
                          <span className="font-sans text-ink-muted">{label}</span>
                          <NumberCell
                            label={`Segment ${i + 1} ${label}`}
                            error={errs[f]?.message}
                            readOnly={readOnly}
                            {...register(`rows.${k}.${f}` as `rows.${number}.durationS`, { valueAsNumber: true })}
                          />
                        </label>
                      ))}
                    </div>
                    {probs ? (
                      <ul className="mt-1 font-sans text-danger">
                        {probs.map((p) => (
                          <li key={p}>{p}</li>
                        ))}
                      </ul>
                    ) : null}
                  </td>
                  <td className="whitespace-nowrap">
                    {!readOnly ? (
                      <>
                        <button type="button" className="btn px-2 py-0.5 text-xs" onClick={() => onEdit(insertSegmentAfter(doc, i))} aria-label={`Add a hold after segment ${i + 1}`}>
                          + after
                        </button>{' '}
                        <button
                          type="button"
                          className="btn px-2 py-0.5 text-xs"
                          disabled={n <= 1}
                          onClick={() => onEdit(removeSegment(doc, i))}
                          aria-label={`Remove segment ${i + 1}`}
                        >
                          remove
                        </button>
                      </>
                    ) : null}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {pages > 1 ? (
        <nav className="mt-2 flex items-center gap-2 text-sm" aria-label="Segment pages">
          <button type="button" className="btn" disabled={page === 0} onClick={() => setPage(page - 1)}>
            Previous
          </button>
          <span className="text-ink-muted">
            Rows <span className="font-mono">{from + 1}–{Math.min(n, from + TABLE_PAGE_ROWS)}</span> of <span className="font-mono">{n}</span>
          </span>
          <button type="button" className="btn" disabled={page >= pages - 1} onClick={() => setPage(page + 1)}>
            Next
          </button>
        </nav>
      ) : null}
    </div>
  );
}

type CellProps = React.InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; ref?: React.Ref<HTMLInputElement> };

function NumberCell({ label, error, readOnly, ...rest }: CellProps) {
  return (
    <span className="inline-flex flex-col">
      <input type="number" step="any" inputMode="decimal" aria-label={label} aria-invalid={error ? true : undefined} readOnly={readOnly} className="field w-20 px-1.5 py-0.5 text-xs" {...rest} />
      {error ? (
        <span className="field-error font-sans" role="alert">
          {error}
        </span>
      ) : null}
    </span>
  );
}
