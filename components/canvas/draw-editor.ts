import type { Context } from 'konva/lib/Context';
import { segmentRate } from '@/lib/schedule/envelope';
import { formatTick, niceTicks } from './model/ticks';
import { hzToY, timeToX, xToTime, type PlotRect, type Viewport } from './model/viewport';
import { findKnot, listKnots, type Knot } from './model/knots';
import { visibleBoundaries } from './model/hit';
import type { EditorDoc } from './model/doc';
import type { DocIssue } from './model/validate';
import { canvasFont, palette } from '@/components/plots/palette';
import { drawFrameAndTickLabels, drawHLine } from '@/components/plots/axes';

/**
 * Drawing for the editor's three layers. The canvas calls these from Konva scene
 * functions with whatever is current (the committed doc, or the doc of a drag in
 * progress), so a drag frame redraws only the envelope layer, not React.
 */

export interface Limits {
  ceilingHz: number;
  maxRateHz?: number;
}

/** Grid, axes with adaptive ticks, and the two limit lines. Redrawn only when the view or size changes. */
export function drawBackground(ctx: Context, vp: Viewport, r: PlotRect, limits: Limits, width: number, height: number) {
  const xt = niceTicks(vp.t0, vp.t1, Math.max(3, Math.floor(r.width / 90)));
  const yt = niceTicks(vp.hz0, vp.hz1, Math.max(3, Math.floor(r.height / 45)));
  ctx.save();
  ctx.setAttr('fillStyle', palette.panel);
  ctx.fillRect(0, 0, width, height);
  ctx.setAttr('strokeStyle', palette.grid);
  ctx.setAttr('lineWidth', 1);
  ctx.beginPath();
  for (const t of xt.ticks) {
    const x = Math.round(timeToX(vp, r, t)) + 0.5;
    if (x < r.x || x > r.x + r.width) continue;
    ctx.moveTo(x, r.y);
    ctx.lineTo(x, r.y + r.height);
  }
  for (const hz of yt.ticks) {
    const y = Math.round(hzToY(vp, r, hz)) + 0.5;
    ctx.moveTo(r.x, y);
    ctx.lineTo(r.x + r.width, y);
  }
  ctx.stroke();

  // The envelope's own domain starts at 0 s: shade what lies before it.
  const x0 = timeToX(vp, r, 0);
  if (x0 > r.x) {
    ctx.setAttr('fillStyle', palette.paper);
    ctx.fillRect(r.x, r.y, Math.min(x0, r.x + r.width) - r.x, r.height);
  }

  drawFrameAndTickLabels(
    ctx,
    r,
    xt.ticks
      .map((t) => ({ text: formatTick(t, xt.step), at: timeToX(vp, r, t) }))
      .filter((l) => l.at >= r.x - 1 && l.at <= r.x + r.width + 1),
    yt.ticks.map((hz) => ({ text: formatTick(hz, yt.step), at: hzToY(vp, r, hz) })),
  );

  ctx.setAttr('fillStyle', palette.ink);
  ctx.setAttr('font', canvasFont('sans', 11, 500));
  ctx.setAttr('textAlign', 'center');
  ctx.setAttr('textBaseline', 'bottom');
  ctx.fillText('time (s)', r.x + r.width / 2, height - 2);
  ctx.save();
  ctx.translate(12, r.y + r.height / 2);
  ctx.rotate(-Math.PI / 2);
  ctx.setAttr('textBaseline', 'top');
  ctx.fillText('rate (Hz)', 0, -2);
  ctx.restore();

  // Labels at opposite ends, so a cap just under the ceiling stays readable.
  limitLine(ctx, vp, r, limits.ceilingHz, palette.danger, `ceiling ${limits.ceilingHz} Hz`, [7, 4], 'right');
  if (limits.maxRateHz !== undefined) limitLine(ctx, vp, r, limits.maxRateHz, palette.warn, `rate cap ${limits.maxRateHz} Hz`, [2, 3], 'left');
  ctx.restore();
}

function limitLine(ctx: Context, vp: Viewport, r: PlotRect, hz: number, color: string, label: string, dash: number[], side: 'left' | 'right') {
  if (!Number.isFinite(hz)) return;
  drawHLine(ctx, r, Math.round(hzToY(vp, r, hz)) + 0.5, color, label, dash, side);
}

export interface EnvelopeDrawState {
  doc: EditorDoc;
  starts: Float64Array;
  issuesByKnot: Map<string, DocIssue[]>;
  segmentIssues: DocIssue[];
  limits: Limits;
}

/** Above this many knots on screen they merge into a line; only selected and faulty ones are drawn. */
const DENSE_KNOTS_PER_PX = 1 / 4;

/** Envelope line and fill, segment problems, and knots: only what lies in the visible time range. */
export function drawEnvelope(ctx: Context, vp: Viewport, r: PlotRect, s: EnvelopeDrawState) {
  const { doc, starts } = s;
  const segs = doc.segments;
  ctx.save();
  ctx.beginPath();
  ctx.rect(r.x, r.y - 6, r.width, r.height + 6);
  ctx.clip();
  if (segs.length === 0) {
    ctx.setAttr('fillStyle', palette.inkMuted);
    ctx.setAttr('font', canvasFont('sans', 12));
    ctx.setAttr('textAlign', 'center');
    ctx.fillText('Empty envelope: click to add the first point.', r.x + r.width / 2, r.y + r.height / 2);
    ctx.restore();
    return;
  }
  const { from, to } = visibleBoundaries(starts, vp);
  const segFrom = Math.max(0, from);
  const segTo = Math.min(segs.length - 1, to);

  for (const issue of s.segmentIssues) {
    if (issue.at.kind !== 'segment') continue;
    const xa = Math.max(r.x, timeToX(vp, r, issue.at.t0));
    const xb = Math.min(r.x + r.width, timeToX(vp, r, issue.at.t1));
    if (xb <= xa) continue;
    ctx.setAttr('fillStyle', palette.danger);
    ctx.setAttr('globalAlpha', 0.1);
    ctx.fillRect(xa, r.y, xb - xa, r.height);
    ctx.setAttr('globalAlpha', 1);
  }

  // One path for line and fill; sines sampled at about 2 px, capped per segment.
  // With more segments than pixels, each pixel column is reduced to its min–max range and
  // the line is drawn as the band those ranges make, filled: the picture is the same, and
  // filling one polygon costs far less than stroking a zigzag of thousands of joins, which
  // dominated the frame while dragging on a dense envelope.
  ctx.beginPath();
  let first = true;
  let lastX = 0;
  const dense = segTo - segFrom + 1 > r.width;
  let col = Number.NaN;
  let colMin = 0;
  let colMax = 0;
  const cols: number[] = [];
  const tops: number[] = [];
  const bottoms: number[] = [];
  const flush = () => {
    if (Number.isNaN(col)) return;
    cols.push(col);
    tops.push(hzToY(vp, r, colMax));
    bottoms.push(hzToY(vp, r, colMin));
  };
  const put = (t: number, hz: number) => {
    const x = timeToX(vp, r, t);
    if (dense) {
      const c = Math.round(x);
      if (c !== col) {
        flush();
        col = c;
        colMin = hz;
        colMax = hz;
      } else {
        if (hz < colMin) colMin = hz;
        if (hz > colMax) colMax = hz;
      }
      return;
    }
    const y = hzToY(vp, r, hz);
    if (first) {
      ctx.moveTo(x, y);
      first = false;
    } else ctx.lineTo(x, y);
    lastX = x;
  };
  const firstX = timeToX(vp, r, starts[segFrom]);
  for (let i = segFrom; i <= segTo; i++) {
    const seg = segs[i];
    const t0 = starts[i];
    if (seg.kind === 'ramp') {
      put(t0, seg.fromHz);
      put(starts[i + 1], seg.toHz);
    } else {
      const a = Math.max(t0, xToTime(vp, r, r.x - 2));
      const b = Math.min(starts[i + 1], xToTime(vp, r, r.x + r.width + 2));
      if (b <= a) {
        put(t0, segmentRate(seg, 0));
        put(starts[i + 1], segmentRate(seg, seg.durationS));
        continue;
      }
      const px = Math.abs(timeToX(vp, r, b) - timeToX(vp, r, a));
      const n = Math.min(4000, Math.max(8, Math.ceil(px / 2), Math.ceil((b - a) * seg.freqHz * 16)));
      for (let k = 0; k <= n; k++) {
        const t = a + ((b - a) * k) / n;
        put(t, segmentRate(seg, t - t0));
      }
    }
  }
  const baseY = hzToY(vp, r, 0);
  if (dense) {
    flush();
    drawBand(ctx, cols, tops, bottoms, baseY);
  } else {
    ctx.setAttr('strokeStyle', palette.envelope);
    ctx.setAttr('lineWidth', 2);
    ctx.setAttr('lineJoin', 'round');
    ctx.stroke();
    ctx.lineTo(lastX, baseY);
    ctx.lineTo(firstX, baseY);
    ctx.closePath();
    ctx.setAttr('fillStyle', palette.envelope);
    ctx.setAttr('globalAlpha', 0.07);
    ctx.fill();
    ctx.setAttr('globalAlpha', 1);
  }

  const selected = new Set(doc.selection);
  const knotsPerPx = (to - from + 1) / r.width;
  // Too many knots to tell apart: draw only the selected and the faulty ones, found without
  // building an object per knot (this runs on every drag frame).
  const candidates =
    knotsPerPx > DENSE_KNOTS_PER_PX
      ? [...doc.selection, ...s.issuesByKnot.keys(), ...faultyKeys(segs, from, to, s.limits)]
          .map((key) => findKnot(segs, key, starts))
          .filter((k): k is Knot => k !== null && k.boundary >= from && k.boundary <= to)
      : listKnots(segs, from, to, starts);
  const labels: { x: number; y: number; text: string }[] = [];
  const drawn = new Set<string>();
  for (const k of candidates) {
    if (drawn.has(k.key)) continue;
    drawn.add(k.key);
    const x = timeToX(vp, r, k.t);
    if (x < r.x - 6 || x > r.x + r.width + 6) continue;
    const y = hzToY(vp, r, k.hz);
    const faults = s.issuesByKnot.get(k.key);
    const live = liveFault(k.hz, s.limits);
    const isSel = selected.has(k.key);
    if (faults || live) {
      drawErrorMarker(ctx, x, y, isSel);
      labels.push({ x, y, text: faults?.[0]?.message ?? live! });
      continue;
    }
    ctx.beginPath();
    // Steps show as two knots at one time: offset their rings sideways a hair so both are grabbable.
    const dx = k.side === 'in' ? -1.5 : k.side === 'out' ? 1.5 : 0;
    ctx.arc(x + dx, y, isSel ? 5.5 : 4, 0, Math.PI * 2);
    ctx.setAttr('fillStyle', isSel ? palette.accent : palette.panel);
    ctx.fill();
    ctx.setAttr('strokeStyle', palette.accent);
    ctx.setAttr('lineWidth', 1.5);
    ctx.stroke();
  }
  // Reasons beside the markers, when they fit; the list under the canvas always has them all.
  if (labels.length <= 6) {
    ctx.setAttr('font', canvasFont('sans', 10, 600));
    ctx.setAttr('textBaseline', 'bottom');
    for (const l of labels) {
      const text = l.text.length > 60 ? `${l.text.slice(0, 59)}…` : l.text;
      const w = ctx.measureText(text).width;
      const right = l.x + 10 + w > r.x + r.width;
      ctx.setAttr('textAlign', right ? 'right' : 'left');
      const tx = right ? l.x - 10 : l.x + 10;
      const ty = Math.max(r.y + 12, l.y - 6);
      ctx.setAttr('fillStyle', palette.panel);
      ctx.setAttr('globalAlpha', 0.85);
      ctx.fillRect(right ? tx - w - 2 : tx - 2, ty - 12, w + 4, 13);
      ctx.setAttr('globalAlpha', 1);
      ctx.setAttr('fillStyle', palette.danger);
      ctx.fillText(text, tx, ty);
    }
  }
  ctx.restore();
}

/**
 * A dense envelope: the area under its upper edge, then the line as the band between each
 * column's lowest and highest rate, widened by one pixel on each side (the 2 px line).
 */
function drawBand(ctx: Context, cols: number[], tops: number[], bottoms: number[], baseY: number) {
  const n = cols.length;
  if (n === 0) return;
  ctx.beginPath();
  ctx.moveTo(cols[0], baseY);
  for (let i = 0; i < n; i++) ctx.lineTo(cols[i], tops[i]);
  ctx.lineTo(cols[n - 1], baseY);
  ctx.closePath();
  ctx.setAttr('fillStyle', palette.envelope);
  ctx.setAttr('globalAlpha', 0.07);
  ctx.fill();
  ctx.setAttr('globalAlpha', 1);

  ctx.beginPath();
  ctx.moveTo(cols[0] - 1, tops[0] - 1);
  for (let i = 0; i < n; i++) ctx.lineTo(cols[i], tops[i] - 1);
  ctx.lineTo(cols[n - 1] + 1, tops[n - 1] - 1);
  ctx.lineTo(cols[n - 1] + 1, bottoms[n - 1] + 1);
  for (let i = n - 1; i >= 0; i--) ctx.lineTo(cols[i], bottoms[i] + 1);
  ctx.lineTo(cols[0] - 1, bottoms[0] + 1);
  ctx.closePath();
  ctx.fill();
}

/** Keys of ramp ends above a limit in boundaries [from, to], scanning numbers only. */
function faultyKeys(segs: EditorDoc['segments'], from: number, to: number, limits: Limits): string[] {
  const top = Math.min(limits.ceilingHz, limits.maxRateHz ?? Infinity);
  const keys: string[] = [];
  for (let b = from; b <= to; b++) {
    const before = segs[b - 1];
    const after = segs[b];
    const inHz = before?.kind === 'ramp' ? before.toHz : -1;
    const outHz = after?.kind === 'ramp' ? after.fromHz : -1;
    if (inHz > top || outHz > top) keys.push(String(b), `${b}<`, `${b}>`);
  }
  return keys;
}

/** During a drag the validated issues are a frame behind; limits are checked inline so the marker follows the pointer. */
function liveFault(hz: number, limits: Limits): string | null {
  if (hz > limits.ceilingHz) return `${hz.toFixed(1)} Hz is above the ceiling (${limits.ceilingHz} Hz)`;
  if (limits.maxRateHz !== undefined && hz > limits.maxRateHz) return `${hz.toFixed(1)} Hz is above the rate cap (${limits.maxRateHz} Hz)`;
  return null;
}

/** A knot with a problem: a filled diamond with a ring, distinct from normal and selected knots by shape as well as colour. */
function drawErrorMarker(ctx: Context, x: number, y: number, selected: boolean) {
  const s = selected ? 7 : 6;
  ctx.beginPath();
  ctx.moveTo(x, y - s);
  ctx.lineTo(x + s, y);
  ctx.lineTo(x, y + s);
  ctx.lineTo(x - s, y);
  ctx.closePath();
  ctx.setAttr('fillStyle', palette.danger);
  ctx.fill();
  ctx.setAttr('strokeStyle', selected ? palette.ink : palette.panel);
  ctx.setAttr('lineWidth', 1.5);
  ctx.stroke();
}

export interface OverlayState {
  box: { x0: number; y0: number; x1: number; y1: number } | null;
  readout: { x: number; y: number; text: string } | null;
  hover: { x: number; y: number } | null;
}

/** Box selection, the drag readout (time and rate) and the hover ring. */
export function drawOverlay(ctx: Context, r: PlotRect, o: OverlayState) {
  ctx.save();
  if (o.hover) {
    ctx.beginPath();
    ctx.arc(o.hover.x, o.hover.y, 8, 0, Math.PI * 2);
    ctx.setAttr('strokeStyle', palette.accent);
    ctx.setAttr('globalAlpha', 0.5);
    ctx.setAttr('lineWidth', 2);
    ctx.stroke();
    ctx.setAttr('globalAlpha', 1);
  }
  if (o.box) {
    const x = Math.min(o.box.x0, o.box.x1);
    const y = Math.min(o.box.y0, o.box.y1);
    const w = Math.abs(o.box.x1 - o.box.x0);
    const h = Math.abs(o.box.y1 - o.box.y0);
    ctx.setAttr('fillStyle', palette.accent);
    ctx.setAttr('globalAlpha', 0.08);
    ctx.fillRect(x, y, w, h);
    ctx.setAttr('globalAlpha', 1);
    ctx.setAttr('strokeStyle', palette.accent);
    ctx.setAttr('lineWidth', 1);
    ctx.setLineDash([4, 3]);
    ctx.strokeRect(x + 0.5, y + 0.5, w, h);
    ctx.setLineDash([]);
  }
  if (o.readout) {
    ctx.setAttr('font', canvasFont('mono', 11, 500));
    const w = ctx.measureText(o.readout.text).width + 12;
    const bx = Math.min(Math.max(r.x, o.readout.x + 12), r.x + r.width - w);
    const by = Math.max(r.y, o.readout.y - 30);
    ctx.setAttr('fillStyle', palette.ink);
    ctx.setAttr('globalAlpha', 0.9);
    ctx.fillRect(bx, by, w, 20);
    ctx.setAttr('globalAlpha', 1);
    ctx.setAttr('fillStyle', palette.panel);
    ctx.setAttr('textAlign', 'left');
    ctx.setAttr('textBaseline', 'middle');
    ctx.fillText(o.readout.text, bx + 6, by + 10);
  }
  ctx.restore();
}
