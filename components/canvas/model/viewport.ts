import type { Segment } from '@/lib/schedule/spec';
import { envelopeMax } from '@/lib/schedule/envelope';
import { totalDuration } from './doc';

/** The visible window: time zooms and pans, rate is fitted (the issue asks for zoom in time). */
export interface Viewport {
  t0: number;
  t1: number;
  hz0: number;
  hz1: number;
}

/** Plot area in pixels, inside the axes. */
export interface PlotRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export const MIN_SPAN_S = 0.01;
export const MAX_SPAN_S = 200_000;

export function timeToX(vp: Viewport, r: PlotRect, t: number): number {
  return r.x + ((t - vp.t0) / (vp.t1 - vp.t0)) * r.width;
}

export function xToTime(vp: Viewport, r: PlotRect, x: number): number {
  return vp.t0 + ((x - r.x) / r.width) * (vp.t1 - vp.t0);
}

export function hzToY(vp: Viewport, r: PlotRect, hz: number): number {
  return r.y + r.height - ((hz - vp.hz0) / (vp.hz1 - vp.hz0)) * r.height;
}

export function yToHz(vp: Viewport, r: PlotRect, y: number): number {
  return vp.hz0 + ((r.y + r.height - y) / r.height) * (vp.hz1 - vp.hz0);
}

/** Zooms time by `factor` (> 1 zooms in) keeping `anchorT` under the pointer. */
export function zoomTime(vp: Viewport, factor: number, anchorT = (vp.t0 + vp.t1) / 2): Viewport {
  const span = clampSpan((vp.t1 - vp.t0) / factor);
  const frac = (anchorT - vp.t0) / (vp.t1 - vp.t0);
  const t0 = anchorT - frac * span;
  return keepStart({ ...vp, t0, t1: t0 + span });
}

export function panTime(vp: Viewport, dt: number): Viewport {
  return keepStart({ ...vp, t0: vp.t0 + dt, t1: vp.t1 + dt });
}

/** Whole envelope in view, with headroom above the highest of envelope, ceiling and cap. */
export function fitView(segments: readonly Segment[], ceilingHz: number, maxRateHz?: number): Viewport {
  const T = totalDuration(segments);
  const span = clampSpan(T > 0 ? T * 1.04 : 10);
  const top = Math.max(envelopeMax(segments), Number.isFinite(ceilingHz) ? ceilingHz : 0, maxRateHz ?? 0, 1);
  return { t0: T > 0 ? -T * 0.02 : 0, t1: (T > 0 ? -T * 0.02 : 0) + span, hz0: 0, hz1: top * 1.1 };
}

function clampSpan(span: number): number {
  return Math.min(MAX_SPAN_S, Math.max(MIN_SPAN_S, span));
}

/** Panning far left of 0 s only shows empty space. */
function keepStart(vp: Viewport): Viewport {
  const span = vp.t1 - vp.t0;
  const minT0 = -span * 0.25;
  return vp.t0 < minT0 ? { ...vp, t0: minT0, t1: minT0 + span } : vp;
}
