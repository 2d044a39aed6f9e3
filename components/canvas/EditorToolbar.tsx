'use client';
import type { SnapGrid } from './model';

export interface EditorToolbarProps {
  canUndo: boolean;
  canRedo: boolean;
  onUndo: () => void;
  onRedo: () => void;
  onZoom: (factor: number) => void;
  onPan: (fraction: number) => void;
  onFit: () => void;
  grid: SnapGrid;
  onGridChange: (grid: SnapGrid) => void;
  selectionCount: number;
  onDeleteSelection: () => void;
  onImport: () => void;
  onDownloadCsv: () => void;
  onDownloadJson: () => void;
  readOnly?: boolean;
}

/** Buttons for everything the pointer and keys do on the canvas, plus the snap grid and file actions. */
export function EditorToolbar(p: EditorToolbarProps) {
  const small = 'btn px-2 py-1 text-xs';
  return (
    <div role="toolbar" aria-label="Envelope editor tools" className="mb-2 flex flex-wrap items-center gap-1.5">
      {!p.readOnly ? (
        <>
          <button type="button" className={small} onClick={p.onUndo} disabled={!p.canUndo} title="Ctrl/⌘ Z">
            Undo
          </button>
          <button type="button" className={small} onClick={p.onRedo} disabled={!p.canRedo} title="Shift Ctrl/⌘ Z">
            Redo
          </button>
          <button type="button" className={small} onClick={p.onDeleteSelection} disabled={p.selectionCount === 0} title="Delete">
            Remove {p.selectionCount > 1 ? `${p.selectionCount} points` : 'point'}
          </button>
          <span className="mx-1 h-5 w-px bg-line" aria-hidden />
        </>
      ) : null}
      <button type="button" className={small} onClick={() => p.onZoom(1.5)} aria-label="Zoom in (time)" title="+">
        Zoom +
      </button>
      <button type="button" className={small} onClick={() => p.onZoom(1 / 1.5)} aria-label="Zoom out (time)" title="−">
        Zoom −
      </button>
      <button type="button" className={small} onClick={() => p.onPan(-0.25)} aria-label="Pan earlier" title="[">
        ◀
      </button>
      <button type="button" className={small} onClick={() => p.onPan(0.25)} aria-label="Pan later" title="]">
        ▶
      </button>
      <button type="button" className={small} onClick={p.onFit} title="F">
        Fit
      </button>
      <span className="mx-1 h-5 w-px bg-line" aria-hidden />
      <fieldset className="flex items-center gap-1.5 text-xs">
        <legend className="sr-only">Snap grid</legend>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={p.grid.enabled} onChange={(e) => p.onGridChange({ ...p.grid, enabled: e.target.checked })} /> Snap
        </label>
        <label className="flex items-center gap-1">
          <span className="sr-only">Grid step in time (s)</span>
          <input
            type="number"
            min={0}
            step="any"
            className="field w-16 px-1 py-0.5 font-mono text-xs"
            value={p.grid.timeS}
            onChange={(e) => p.onGridChange({ ...p.grid, timeS: Math.max(0, Number(e.target.value) || 0) })}
          />
          s
        </label>
        <label className="flex items-center gap-1">
          <span className="sr-only">Grid step in rate (Hz)</span>
          <input
            type="number"
            min={0}
            step="any"
            className="field w-16 px-1 py-0.5 font-mono text-xs"
            value={p.grid.rateHz}
            onChange={(e) => p.onGridChange({ ...p.grid, rateHz: Math.max(0, Number(e.target.value) || 0) })}
          />
          Hz
        </label>
      </fieldset>
      <span className="mx-1 h-5 w-px bg-line" aria-hidden />
      {!p.readOnly ? (
        <button type="button" className={small} onClick={p.onImport}>
          Import CSV…
        </button>
      ) : null}
      <button type="button" className={small} onClick={p.onDownloadCsv}>
        Download CSV
      </button>
      <button type="button" className={small} onClick={p.onDownloadJson}>
        Download spec JSON
      </button>
    </div>
  );
}
