'use client';
import dynamic from 'next/dynamic';
import { useCallback, useDeferredValue, useMemo, useState } from 'react';
import type { Spec, SpecError } from '@/lib/schedule/spec';
import { envelopeToCsv, envelopeToSpecJson } from '@/lib/envelope-io';
import { PREVIEW_DEFAULT_TRIALS, PREVIEW_MAX_TRIALS } from '@/lib/preview/request';
import { downloadText, safeFileStem } from './download';
import { EditorToolbar } from './EditorToolbar';
import { EnvelopeImportDialog } from './EnvelopeImportDialog';
import { IssueList } from './IssueList';
import {
  boundaries,
  canRedo,
  canUndo,
  commit,
  createDoc,
  createHistory,
  deletePoints,
  DEFAULT_GRID,
  findKnot,
  fitView,
  insertShape,
  knotsAt,
  joinSpec,
  panTime,
  redo,
  saveBlockers,
  setSelection,
  splitSpec,
  totalDuration,
  undo,
  locateIssues,
  zoomTime,
  type EditorDoc,
  type History,
  type Shape,
  type SnapGrid,
  type Span,
  type SpecSettings,
  type Viewport,
} from './model';
import { Providers } from './Providers';
import { SaveBar, type SaveResult } from './SaveBar';
import { SeedControls } from './SeedControls';
import { SegmentTable } from './SegmentTable';
import { ShapeInsertForm } from './ShapeInsertForm';
import { SpecSettingsForm } from './SpecSettingsForm';
import { usePreview } from './usePreview';

// Konva needs a browser canvas: the editor and the plots load on the client only.
const EnvelopeCanvas = dynamic(() => import('./EnvelopeCanvas').then((m) => m.EnvelopeCanvas), {
  ssr: false,
  loading: () => <div className="flex h-[340px] items-center justify-center rounded-md border border-line text-sm text-ink-muted">Loading the editor…</div>,
});
const PreviewPanel = dynamic(() => import('@/components/plots/PreviewPanel').then((m) => m.PreviewPanel), {
  ssr: false,
  loading: () => <p className="text-sm text-ink-muted">Loading the preview…</p>,
});

export interface EnvelopeWorkbenchProps {
  initialSpec: Spec;
  readOnly?: boolean;
  onSave?: (spec: Spec) => Promise<SaveResult>;
  /** Route handler for live previews (POST { spec, trials }). */
  previewUrl?: string;
  /** Stem for downloaded files; defaults to "envelope". */
  downloadName?: string;
}

/**
 * The whole envelope workbench: canvas and table on one document with shared undo,
 * shape tool, CSV import/export, the other spec settings and the seed, saving (blocked
 * with reasons while invalid) and the live preview. Brings its own react-query provider.
 */
export function EnvelopeWorkbench(props: EnvelopeWorkbenchProps) {
  return (
    <Providers>
      <Workbench {...props} />
    </Providers>
  );
}

export default EnvelopeWorkbench;

function Workbench({ initialSpec, readOnly, onSave, previewUrl = '/api/preview', downloadName }: EnvelopeWorkbenchProps) {
  const initial = useMemo(() => splitSpec(initialSpec), [initialSpec]);
  const [history, setHistory] = useState<History>(() => createHistory(createDoc(initial.envelope)));
  const [settings, setSettings] = useState<SpecSettings>(initial.settings);
  const [viewport, setViewport] = useState<Viewport>(() => fitView(initial.envelope, initial.settings.ceilingHz, initial.settings.caps?.maxRateHz));
  const [grid, setGrid] = useState<SnapGrid>(DEFAULT_GRID);
  const [previewTrials, setPreviewTrials] = useState(PREVIEW_DEFAULT_TRIALS);
  const [importOpen, setImportOpen] = useState(false);
  const [tablePending, setTablePending] = useState<SpecError[]>([]);

  const doc = history.present;
  const spec = useMemo(() => joinSpec(doc.segments as Spec['envelope'], settings), [doc.segments, settings]);
  const maxRateHz = settings.caps?.maxRateHz;
  // One validation of the whole spec serves both the save button and the canvas markers.
  // It runs on a deferred copy: on a long envelope the parse takes tens of ms, and the
  // frame that ends a drag should not wait for it. Saving waits until it has caught up.
  const checkedSpec = useDeferredValue(spec);
  const checkedDoc = useDeferredValue(doc);
  const checking = checkedSpec !== spec;
  const blockers = useMemo(() => saveBlockers(checkedSpec), [checkedSpec]);
  const issues = useMemo(
    () => locateIssues(checkedDoc, checkedDoc.segments === checkedSpec.envelope ? blockers : [], { ceilingHz: checkedSpec.ceilingHz, maxRateHz: checkedSpec.caps?.maxRateHz }),
    [checkedDoc, checkedSpec, blockers],
  );
  const preview = usePreview({ spec: checkedSpec, valid: blockers.length === 0, trials: previewTrials, url: previewUrl });
  // Stable, so the memoized preview panel skips renders that change only the editor.
  const previewError = useMemo(() => (preview.error ? { message: preview.error.message, errors: preview.error.errors } : null), [preview.error]);

  const edit = useCallback((next: EditorDoc, tag?: string) => setHistory((h) => commit(h, next, tag)), []);
  const selectOnly = useCallback((next: EditorDoc) => setHistory((h) => setSelection(h, next.selection)), []);
  const doUndo = useCallback(() => setHistory(undo), []);
  const doRedo = useCallback(() => setHistory(redo), []);

  /** Brings a selection made outside the canvas (table, issue list) into view. */
  const reveal = useCallback(
    (next: EditorDoc) => {
      const starts = boundaries(next.segments);
      const times = next.selection.map((k) => findKnot(next.segments, k, starts)?.t).filter((t): t is number => t !== undefined);
      if (times.length === 0) return;
      const t = Math.min(...times);
      setViewport((vp) => (t < vp.t0 || t > vp.t1 ? panTime(vp, t - (vp.t0 + vp.t1) / 2) : vp));
    },
    [],
  );

  const selectionSpan: Span | null = useMemo(() => {
    const starts = boundaries(doc.segments);
    const times = doc.selection.map((k) => findKnot(doc.segments, k, starts)?.t).filter((t): t is number => t !== undefined);
    if (times.length < 2) return null;
    const lo = Math.min(...times);
    const hi = Math.max(...times);
    return hi > lo ? { startS: lo, endS: hi } : null;
  }, [doc]);

  // First offer: the middle third of what is in view (within the envelope when there is one).
  const [initialSpan] = useState<Span>(() => {
    const T = totalDuration(initial.envelope);
    const a = Math.max(0, viewport.t0);
    const b = T > a ? Math.min(T, viewport.t1) : a + 10;
    return { startS: a + (b - a) / 3, endS: a + (2 * (b - a)) / 3 };
  });

  const stem = safeFileStem(downloadName ?? 'envelope');

  return (
    <div className="space-y-6">
      <SaveBar spec={spec} checking={checking} blockers={tablePending.length ? [...tablePending, ...blockers] : blockers} readOnly={readOnly} onSave={onSave} />

      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <section className="card min-w-0" aria-label="Envelope">
          <EditorToolbar
            canUndo={canUndo(history)}
            canRedo={canRedo(history)}
            onUndo={doUndo}
            onRedo={doRedo}
            onZoom={(f) => setViewport((vp) => zoomTime(vp, f))}
            onPan={(fr) => setViewport((vp) => panTime(vp, (vp.t1 - vp.t0) * fr))}
            onFit={() => setViewport(fitView(doc.segments, settings.ceilingHz, maxRateHz))}
            grid={grid}
            onGridChange={setGrid}
            selectionCount={doc.selection.length}
            onDeleteSelection={() => {
              const res = deletePoints(doc, doc.selection);
              if (res.doc !== doc) edit(res.doc);
            }}
            onImport={() => setImportOpen(true)}
            onDownloadCsv={() => downloadText(`${stem}.csv`, envelopeToCsv(doc.segments), 'text/csv')}
            onDownloadJson={() => downloadText(`${stem}.spec.json`, envelopeToSpecJson(spec), 'application/json')}
            readOnly={readOnly}
          />
          <EnvelopeCanvas
            doc={doc}
            issues={issues}
            ceilingHz={settings.ceilingHz}
            maxRateHz={maxRateHz}
            viewport={viewport}
            onViewportChange={setViewport}
            grid={grid}
            readOnly={readOnly}
            onEdit={edit}
            onSelect={selectOnly}
            onUndo={doUndo}
            onRedo={doRedo}
          />
          <IssueList
            issues={issues}
            onShow={(issue) => {
              if (issue.at.kind === 'point') {
                const next = createDoc(doc.segments, [issue.at.key]);
                selectOnly(next);
                reveal(next);
              } else if (issue.at.kind === 'segment') {
                const { index, t0, t1 } = issue.at;
                const starts = boundaries(doc.segments);
                const own = [
                  ...knotsAt(doc.segments, index, starts[index]).filter((k) => k.side !== 'in'),
                  ...knotsAt(doc.segments, index + 1, starts[index + 1]).filter((k) => k.side !== 'out'),
                ];
                selectOnly(createDoc(doc.segments, own.map((k) => k.key)));
                setViewport((vp) => (t1 < vp.t0 || t0 > vp.t1 ? panTime(vp, (t0 + t1) / 2 - (vp.t0 + vp.t1) / 2) : vp));
              }
            }}
          />
        </section>

        <aside className="space-y-6">
          <section className="card" aria-label="Seed">
            <SeedControls seed={settings.seed} readOnly={readOnly} onChange={(seed) => setSettings((s) => ({ ...s, seed }))} />
          </section>
          {!readOnly ? (
            <section className="card" aria-labelledby="shape-tool-title">
              <h2 id="shape-tool-title" className="mb-3">
                Shape tool
              </h2>
              <ShapeInsertForm initialSpan={initialSpan} selectionSpan={selectionSpan} onInsert={(shape: Shape, span: Span) => edit(insertShape(doc, shape, span))} />
            </section>
          ) : null}
          <section className="card" aria-labelledby="settings-title">
            <h2 id="settings-title" className="mb-3">
              Schedule settings
            </h2>
            <SpecSettingsForm settings={settings} envelope={spec.envelope} readOnly={readOnly} onChange={(s) => setSettings((old) => ({ ...s, seed: old.seed }))} />
          </section>
        </aside>
      </div>

      <section className="card" aria-labelledby="segments-title">
        <h2 id="segments-title" className="mb-3">
          Segments
        </h2>
        <SegmentTable
          doc={doc}
          issues={issues}
          readOnly={readOnly}
          onEdit={edit}
          onSelect={(next) => {
            selectOnly(next);
            reveal(next);
          }}
          onPendingErrors={setTablePending}
        />
      </section>

      <section className="card">
        <PreviewPanel
          data={preview.data}
          loading={preview.loading}
          stale={preview.stale}
          blocked={preview.blocked}
          error={previewError}
          seed={settings.seed}
          trials={previewTrials}
          maxTrials={PREVIEW_MAX_TRIALS}
          onTrialsChange={setPreviewTrials}
        />
      </section>

      <EnvelopeImportDialog open={importOpen} onClose={() => setImportOpen(false)} onReplace={(envelope) => {
        const next = createDoc(envelope);
        edit(next);
        setViewport(fitView(envelope, settings.ceilingHz, maxRateHz));
      }} />
    </div>
  );
}
