import type { Context } from 'konva/lib/Context';
import { formatTick, niceTicks } from '@/components/canvas/model/ticks';
import type { PlotRect } from '@/components/canvas/model/viewport';
import { canvasFont, palette } from './palette';

export interface AxisSpec {
  min: number;
  max: number;
  /** Axis title with its unit, e.g. "time (s)". */
  label: string;
  /** About how many ticks. */
  ticks?: number;
  /** Integer-only ticks (trial numbers, counts). */
  integer?: boolean;
}

export const PLOT_MARGIN = { left: 52, right: 12, top: 10, bottom: 36 } as const;

export function plotRect(width: number, height: number, margin = PLOT_MARGIN): PlotRect {
  return { x: margin.left, y: margin.top, width: Math.max(10, width - margin.left - margin.right), height: Math.max(10, height - margin.top - margin.bottom) };
}

export const xOf = (r: PlotRect, a: AxisSpec, v: number) => r.x + ((v - a.min) / (a.max - a.min || 1)) * r.width;
export const yOf = (r: PlotRect, a: AxisSpec, v: number) => r.y + r.height - ((v - a.min) / (a.max - a.min || 1)) * r.height;

function ticksFor(a: AxisSpec) {
  const t = niceTicks(a.min, a.max, a.ticks ?? 6);
  if (!a.integer) return t;
  const step = Math.max(1, Math.round(t.step));
  return { step, ticks: t.ticks.filter((v) => Number.isInteger(v) && v % step === 0) };
}

export type TickLabel = { text: string; at: number };

/** The L-shaped axis frame and the tick labels below and left of it; shared with the envelope editor. */
export function drawFrameAndTickLabels(ctx: Context, r: PlotRect, xLabels: TickLabel[], yLabels: TickLabel[]) {
  ctx.setAttr('strokeStyle', palette.inkMuted);
  ctx.beginPath();
  ctx.moveTo(r.x + 0.5, r.y);
  ctx.lineTo(r.x + 0.5, r.y + r.height + 0.5);
  ctx.lineTo(r.x + r.width, r.y + r.height + 0.5);
  ctx.stroke();

  ctx.setAttr('fillStyle', palette.inkMuted);
  ctx.setAttr('font', canvasFont('mono', 10));
  ctx.setAttr('textAlign', 'center');
  ctx.setAttr('textBaseline', 'top');
  for (const l of xLabels) ctx.fillText(l.text, l.at, r.y + r.height + 4);
  ctx.setAttr('textAlign', 'right');
  ctx.setAttr('textBaseline', 'middle');
  for (const l of yLabels) ctx.fillText(l.text, r.x - 5, l.at);
}

/** Grid, axis lines, tick labels and axis titles with units. */
export function drawAxes(ctx: Context, r: PlotRect, x: AxisSpec, y: AxisSpec, opts: { grid?: boolean } = {}) {
  const xt = ticksFor(x);
  const yt = ticksFor(y);
  ctx.save();
  if (opts.grid !== false) {
    ctx.setAttr('strokeStyle', palette.grid);
    ctx.setAttr('lineWidth', 1);
    ctx.beginPath();
    for (const v of xt.ticks) {
      const px = Math.round(xOf(r, x, v)) + 0.5;
      ctx.moveTo(px, r.y);
      ctx.lineTo(px, r.y + r.height);
    }
    for (const v of yt.ticks) {
      const py = Math.round(yOf(r, y, v)) + 0.5;
      ctx.moveTo(r.x, py);
      ctx.lineTo(r.x + r.width, py);
    }
    ctx.stroke();
  }
  drawFrameAndTickLabels(
    ctx,
    r,
    xt.ticks.map((v) => ({ text: formatTick(v, xt.step), at: xOf(r, x, v) })),
    yt.ticks.map((v) => ({ text: formatTick(v, yt.step), at: yOf(r, y, v) })),
  );

  ctx.setAttr('fillStyle', palette.ink);
  ctx.setAttr('font', canvasFont('sans', 11, 500));
  ctx.setAttr('textAlign', 'center');
  ctx.setAttr('textBaseline', 'bottom');
  ctx.fillText(x.label, r.x + r.width / 2, r.y + r.height + 34);
  ctx.translate(12, r.y + r.height / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.setAttr('textBaseline', 'top');
  ctx.fillText(y.label, 0, -2);
  ctx.restore();
}

/** A horizontal reference line across the plot with a label at its right end. */
export function drawHLine(ctx: Context, r: PlotRect, y: number, color: string, label: string, dash: number[] = [6, 4], side: 'left' | 'right' = 'right') {
  if (y < r.y - 0.5 || y > r.y + r.height + 0.5) return;
  ctx.save();
  ctx.setAttr('strokeStyle', color);
  ctx.setAttr('lineWidth', 1.5);
  ctx.setLineDash(dash);
  ctx.beginPath();
  ctx.moveTo(r.x, y);
  ctx.lineTo(r.x + r.width, y);
  ctx.stroke();
  ctx.setLineDash([]);
  ctx.setAttr('fillStyle', color);
  ctx.setAttr('font', canvasFont('sans', 10, 600));
  ctx.setAttr('textAlign', side);
  ctx.setAttr('textBaseline', 'bottom');
  ctx.fillText(label, side === 'right' ? r.x + r.width - 4 : r.x + 4, y - 2);
  ctx.restore();
}
