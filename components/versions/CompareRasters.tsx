'use client';
import { useMemo, useState } from 'react';
import { drawAxes, plotRect, xOf, yOf, type AxisSpec } from '@/components/plots/axes';
import { PlotStage } from '@/components/plots/PlotStage';
import { palette } from '@/components/plots/palette';
import type { TrialComparison } from '@/lib/versions/pulse-compare';

export interface CompareRastersProps {
  before: string;
  after: string;
  durationS: number;
  trials: TrialComparison[];
}

type Side = 'before' | 'after';

/**
 * The same trials of two versions side by side. Pulses both schedules share are drawn thin
 * in ink; pulses only the earlier one has (removed) and only the later one has (added) are
 * drawn full-height in colour, so a change shows where it happens.
 */
export function CompareRasters({ before, after, durationS, trials }: CompareRastersProps) {
  const [win, setWin] = useState<{ t0: number; t1: number }>({ t0: 0, t1: durationS });
  const [draft, setDraft] = useState({ t0: '0', t1: String(durationS) });
  const firstChange = useMemo(() => {
    let t = Infinity;
    for (const tr of trials) t = Math.min(t, tr.removed[0] ?? Infinity, tr.added[0] ?? Infinity);
    return Number.isFinite(t) ? t : null;
  }, [trials]);

  const apply = (t0: number, t1: number) => {
    const a = Math.max(0, Math.min(t0, durationS));
    const b = Math.max(a + 0.001, Math.min(t1, durationS));
    setWin({ t0: a, t1: b });
    setDraft({ t0: String(round(a)), t1: String(round(b)) });
  };

  return (
    <div className="space-y-3">
      <form
        className="flex flex-wrap items-end gap-3 text-sm"
        onSubmit={(e) => {
          e.preventDefault();
          apply(Number(draft.t0), Number(draft.t1));
        }}
      >
        <div>
          <label htmlFor="cmp-from" className="label">From (s)</label>
          <input id="cmp-from" type="number" step="any" min={0} max={durationS} className="field w-28" value={draft.t0} onChange={(e) => setDraft((d) => ({ ...d, t0: e.target.value }))} />
        </div>
        <div>
          <label htmlFor="cmp-to" className="label">To (s)</label>
          <input id="cmp-to" type="number" step="any" min={0} max={durationS} className="field w-28" value={draft.t1} onChange={(e) => setDraft((d) => ({ ...d, t1: e.target.value }))} />
        </div>
        <button type="submit" className="btn">Show</button>
        <button type="button" className="btn" onClick={() => apply(0, durationS)}>Whole trial</button>
        {firstChange !== null ? (
          <button type="button" className="btn" onClick={() => apply(firstChange - 1, firstChange + 4)}>
            First change ({round(firstChange)} s)
          </button>
        ) : null}
      </form>
      <p className="text-xs text-ink-muted">
        <span className="mr-3"><span aria-hidden="true" className="mr-1 inline-block h-3 w-0.5 align-middle" style={{ background: palette.ink }} />in both</span>
        <span className="mr-3"><span aria-hidden="true" className="mr-1 inline-block h-3 w-1 align-middle" style={{ background: palette.danger }} />only in {before} (removed)</span>
        <span><span aria-hidden="true" className="mr-1 inline-block h-3 w-1 align-middle" style={{ background: palette.accent }} />only in {after} (added)</span>
      </p>
      <div className="grid gap-4 xl:grid-cols-2">
        <SideRaster side="before" label={before} trials={trials} win={win} />
        <SideRaster side="after" label={after} trials={trials} win={win} />
      </div>
    </div>
  );
}

function SideRaster({ side, label, trials, win }: { side: Side; label: string; trials: TrialComparison[]; win: { t0: number; t1: number } }) {
  const n = trials.length;
  const changed = trials.reduce((a, t) => a + (side === 'before' ? t.removed.length : t.added.length), 0);
  const shared = trials.reduce((a, t) => a + t.unchanged.length, 0);
  const height = Math.min(320, 80 + n * 22);
  const highlight = side === 'before' ? palette.danger : palette.accent;
  return (
    <PlotStage
      title={label}
      description={`${n} trials from ${round(win.t0)} to ${round(win.t1)} s: ${shared} pulses shared with the other version, ${changed} ${side === 'before' ? 'removed' : 'added'}.`}
      height={height}
      draw={(ctx, w, h) => {
        const r = plotRect(w, h);
        const x: AxisSpec = { min: win.t0, max: win.t1, label: 'time (s)' };
        const y: AxisSpec = { min: 0.5, max: n + 0.5, label: 'trial', integer: true, ticks: Math.min(n, 8) };
        drawAxes(ctx, r, x, y, { grid: false });
        const rowH = r.height / Math.max(1, n);
        const inWin = (t: number) => t >= win.t0 && t <= win.t1;
        const ticks = (list: number[], cy: number, half: number) => {
          for (const t of list) {
            if (!inWin(t)) continue;
            const px = Math.round(xOf(r, x, t)) + 0.5;
            ctx.moveTo(px, cy - half);
            ctx.lineTo(px, cy + half);
          }
        };
        ctx.save();
        ctx.setAttr('lineWidth', 1);
        ctx.setAttr('strokeStyle', palette.ink);
        ctx.beginPath();
        // Row i + 1 is the i-th trial shown, as the axis labels say.
        trials.forEach((tr, i) => ticks(tr.unchanged, yOf(r, y, i + 1), Math.max(2, rowH * 0.3)));
        ctx.stroke();
        ctx.setAttr('lineWidth', 2);
        ctx.setAttr('strokeStyle', highlight);
        ctx.beginPath();
        trials.forEach((tr, i) => ticks(side === 'before' ? tr.removed : tr.added, yOf(r, y, i + 1), Math.max(3, rowH * 0.45)));
        ctx.stroke();
        ctx.restore();
      }}
    />
  );
}

function round(x: number): number {
  return Math.round(x * 1000) / 1000;
}
