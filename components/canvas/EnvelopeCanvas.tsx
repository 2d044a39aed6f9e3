'use client';
import type Konva from 'konva';
import type { Context } from 'konva/lib/Context';
import { useCallback, useEffect, useId, useMemo, useRef, useState } from 'react';
import { Layer, Shape, Stage } from 'react-konva';
import { useElementWidth } from '@/components/plots/useElementWidth';
import { drawBackground, drawEnvelope, drawOverlay, type EnvelopeDrawState, type OverlayState } from './draw-editor';
import {
  addPoint,
  addPointAfterSelection,
  boundaries,
  deletePoints,
  dragPoints,
  findKnot,
  fitView,
  hzToY,
  issuesByKnot,
  keyAction,
  KEY_HELP,
  knotAtPointer,
  knotsInBox,
  nudge,
  panTime,
  select,
  selectAll,
  selectStep,
  timeToX,
  xToTime,
  yToHz,
  zoomTime,
  type DocIssue,
  type EditorAction,
  type EditorDoc,
  type PlotRect,
  type SnapGrid,
  type Viewport,
} from './model';

export interface EnvelopeCanvasProps {
  doc: EditorDoc;
  issues: readonly DocIssue[];
  ceilingHz: number;
  maxRateHz?: number;
  viewport: Viewport;
  onViewportChange: (vp: Viewport) => void;
  grid: SnapGrid;
  readOnly?: boolean;
  /** An edit for the undo history; commits with the same tag form one undo step. */
  onEdit: (doc: EditorDoc, tag?: string) => void;
  /** Selection-only change (not an undo step). */
  onSelect: (doc: EditorDoc) => void;
  onUndo: () => void;
  onRedo: () => void;
  height?: number;
}

const MARGIN = { left: 52, right: 14, top: 14, bottom: 38 };
const DRAG_THRESHOLD_PX = 3;

type Gesture =
  | { kind: 'press-empty'; x: number; y: number; additive: boolean }
  | { kind: 'box'; x0: number; y0: number; x1: number; y1: number; additive: boolean }
  | { kind: 'press-knot'; x: number; y: number; anchor: EditorDoc; keys: string[]; primary: string }
  | { kind: 'drag'; anchor: EditorDoc; keys: string[]; primary: string; current: EditorDoc }
  | { kind: 'pan'; x0: number; vp0: Viewport };

const fmtT = (t: number) => `${t.toFixed(3)} s`;
const fmtHz = (hz: number) => `${hz.toFixed(1)} Hz`;

/**
 * The envelope editor. React renders the stage once per committed change; everything
 * that happens per pointer move (dragging points, box selection, panning) is drawn from
 * refs straight into the Konva layers, so a drag on a 5,000-point envelope costs one
 * model update and one redraw of the visible part per animation frame. The background
 * layer (grid, axes, limit lines) is redrawn only when the view changes. Knots are not
 * Konva nodes and layers do not listen: hits are found by the model's binary search.
 */
export function EnvelopeCanvas(props: EnvelopeCanvasProps) {
  const { doc, issues, ceilingHz, maxRateHz, viewport, readOnly, height = 340 } = props;
  const { ref: boxRef, width } = useElementWidth<HTMLDivElement>(800);
  const helpId = useId();
  const [status, setStatus] = useState('');

  const rect: PlotRect = useMemo(
    () => ({ x: MARGIN.left, y: MARGIN.top, width: Math.max(50, width - MARGIN.left - MARGIN.right), height: Math.max(50, height - MARGIN.top - MARGIN.bottom) }),
    [width, height],
  );

  // Everything the scene functions read. Props flow in here on each render; gestures write here directly.
  const latest = useRef(props);
  latest.current = props;
  const vpRef = useRef(viewport);
  const rectRef = useRef(rect);
  rectRef.current = rect;
  const limits = useMemo(() => ({ ceilingHz, maxRateHz }), [ceilingHz, maxRateHz]);
  const byKnot = useMemo(() => issuesByKnot(issues), [issues]);
  const segmentIssues = useMemo(() => issues.filter((i) => i.at.kind === 'segment'), [issues]);
  const starts = useMemo(() => boundaries(doc.segments), [doc.segments]);
  const drawState = useRef<EnvelopeDrawState>({ doc, starts, issuesByKnot: byKnot, segmentIssues, limits });
  const overlay = useRef<OverlayState>({ box: null, readout: null, hover: null });
  const gesture = useRef<Gesture | null>(null);
  const dragCount = useRef(0);
  const nudgeGesture = useRef(0);

  const bgLayer = useRef<Konva.Layer>(null);
  const envLayer = useRef<Konva.Layer>(null);
  const overLayer = useRef<Konva.Layer>(null);

  const redraw = useCallback((what: { bg?: boolean; env?: boolean; over?: boolean }) => {
    if (what.bg) bgLayer.current?.batchDraw();
    if (what.env) envLayer.current?.batchDraw();
    if (what.over) overLayer.current?.batchDraw();
  }, []);

  // Committed state → refs → redraw. No React work happens per pointer move.
  useEffect(() => {
    if (gesture.current?.kind === 'drag') return;
    drawState.current = { doc, starts, issuesByKnot: byKnot, segmentIssues, limits };
    redraw({ env: true });
  }, [doc, starts, byKnot, segmentIssues, limits, redraw]);

  useEffect(() => {
    if (gesture.current?.kind === 'pan') return;
    vpRef.current = viewport;
    redraw({ bg: true, env: true, over: true });
  }, [viewport, redraw]);

  useEffect(() => {
    redraw({ bg: true, env: true, over: true });
  }, [rect, limits, redraw]);

  const bgScene = useCallback((ctx: Context) => drawBackground(ctx, vpRef.current, rectRef.current, drawState.current.limits, rectRef.current.x + rectRef.current.width + MARGIN.right, rectRef.current.y + rectRef.current.height + MARGIN.bottom), []);
  const envScene = useCallback((ctx: Context) => drawEnvelope(ctx, vpRef.current, rectRef.current, drawState.current), []);
  const overScene = useCallback((ctx: Context) => drawOverlay(ctx, rectRef.current, overlay.current), []);

  const announce = useCallback((d: EditorDoc, prefix = '') => {
    const keys = d.selection;
    if (keys.length === 0) return setStatus(prefix || 'No point selected.');
    if (keys.length > 1) return setStatus(`${prefix}${keys.length} points selected.`);
    const k = findKnot(d.segments, keys[0]);
    setStatus(k ? `${prefix}Point at ${fmtT(k.t)}, ${fmtHz(k.hz)}.` : prefix);
  }, []);

  const setView = useCallback(
    (vp: Viewport) => {
      vpRef.current = vp;
      redraw({ bg: true, env: true, over: true });
      latest.current.onViewportChange(vp);
    },
    [redraw],
  );

  // --- pointer -------------------------------------------------------------------------

  const local = (e: { clientX: number; clientY: number }) => {
    const b = boxRef.current!.getBoundingClientRect();
    return { x: e.clientX - b.left, y: e.clientY - b.top };
  };

  const frame = useRef<number | null>(null);
  const pending = useRef<{ x: number; y: number } | null>(null);

  const dragFrame = useCallback(() => {
    frame.current = null;
    const g = gesture.current;
    const p = pending.current;
    if (!g || !p) return;
    const vp = vpRef.current;
    const r = rectRef.current;
    if (g.kind === 'drag') {
      const res = dragPoints(g.anchor, g.keys, g.primary, { t: xToTime(vp, r, p.x), hz: yToHz(vp, r, p.y) }, latest.current.grid);
      g.current = res.doc;
      drawState.current = { ...drawState.current, doc: res.doc, starts: boundaries(res.doc.segments) };
      overlay.current = { ...overlay.current, readout: { x: p.x, y: p.y, text: `${fmtT(res.t)} · ${fmtHz(res.hz)}` }, hover: null };
      redraw({ env: true, over: true });
    } else if (g.kind === 'box') {
      g.x1 = p.x;
      g.y1 = p.y;
      overlay.current = { ...overlay.current, box: { x0: g.x0, y0: g.y0, x1: g.x1, y1: g.y1 } };
      redraw({ over: true });
    } else if (g.kind === 'pan') {
      const dt = xToTime(g.vp0, r, g.x0) - xToTime(g.vp0, r, p.x);
      vpRef.current = panTime(g.vp0, dt);
      redraw({ bg: true, env: true, over: true });
    }
  }, [redraw]);

  const schedule = (p: { x: number; y: number }) => {
    pending.current = p;
    if (frame.current === null) frame.current = requestAnimationFrame(dragFrame);
  };

  const onPointerDown = (e: React.PointerEvent<HTMLDivElement>) => {
    if (e.button !== 0 && e.button !== 1) return;
    // Focus for the keys, without scrolling: a canvas partly off screen would jump under the
    // pointer between press and release, and the click would land somewhere else.
    e.currentTarget.focus({ preventScroll: true });
    e.currentTarget.setPointerCapture(e.pointerId);
    const p = local(e);
    const vp = vpRef.current;
    const r = rectRef.current;
    const d = latest.current.doc;
    // Middle button, Alt, or a press on the time axis below the plot: pan.
    if (e.button === 1 || e.altKey || p.y > r.y + r.height + 2) {
      gesture.current = { kind: 'pan', x0: p.x, vp0: vp };
      return;
    }
    const hit = knotAtPointer(d.segments, drawState.current.starts, vp, r, p.x, p.y);
    if (hit) {
      if (e.shiftKey) {
        const next = select(d, [hit.key], 'toggle');
        latest.current.onSelect(next);
        announce(next);
        gesture.current = null;
        return;
      }
      let sel = d;
      if (!d.selection.includes(hit.key)) {
        sel = select(d, [hit.key]);
        latest.current.onSelect(sel);
      }
      announce(sel);
      gesture.current = readOnly ? null : { kind: 'press-knot', x: p.x, y: p.y, anchor: sel, keys: [...sel.selection], primary: hit.key };
      return;
    }
    gesture.current = { kind: 'press-empty', x: p.x, y: p.y, additive: e.shiftKey };
  };

  const onPointerMove = (e: React.PointerEvent<HTMLDivElement>) => {
    const p = local(e);
    const g = gesture.current;
    if (!g) {
      // Hover ring: cheap (binary search), and only the overlay redraws, only when it changes.
      const vp = vpRef.current;
      const r = rectRef.current;
      const hit = knotAtPointer(latest.current.doc.segments, drawState.current.starts, vp, r, p.x, p.y);
      const hover = hit ? { x: timeToX(vp, r, hit.t), y: hzToY(vp, r, hit.hz) } : null;
      const was = overlay.current.hover;
      if (hover?.x !== was?.x || hover?.y !== was?.y) {
        overlay.current = { ...overlay.current, hover };
        redraw({ over: true });
      }
      return;
    }
    if (g.kind === 'press-knot' || g.kind === 'press-empty') {
      if (Math.hypot(p.x - g.x, p.y - g.y) < DRAG_THRESHOLD_PX) return;
      gesture.current =
        g.kind === 'press-knot'
          ? { kind: 'drag', anchor: g.anchor, keys: g.keys, primary: g.primary, current: g.anchor }
          : { kind: 'box', x0: g.x, y0: g.y, x1: p.x, y1: p.y, additive: g.additive };
    }
    schedule(p);
  };

  const finish = (cancelled: boolean) => {
    const g = gesture.current;
    gesture.current = null;
    if (frame.current !== null) {
      cancelAnimationFrame(frame.current);
      frame.current = null;
      if (!cancelled && g) {
        gesture.current = g;
        dragFrame();
        gesture.current = null;
      }
    }
    overlay.current = { box: null, readout: null, hover: null };
    redraw({ over: true });
    if (!g) return;
    const vp = vpRef.current;
    const r = rectRef.current;
    if (g.kind === 'drag') {
      if (!cancelled && g.current !== g.anchor) {
        dragCount.current++;
        latest.current.onEdit(g.current, `drag-${dragCount.current}`);
        announce(g.current, 'Moved. ');
      } else {
        drawState.current = { ...drawState.current, doc: latest.current.doc, starts: boundaries(latest.current.doc.segments) };
        redraw({ env: true });
      }
    } else if (g.kind === 'box' && !cancelled) {
      const keys = knotsInBox(latest.current.doc, { t0: xToTime(vp, r, g.x0), t1: xToTime(vp, r, g.x1), hz0: yToHz(vp, r, g.y0), hz1: yToHz(vp, r, g.y1) });
      const next = select(latest.current.doc, keys, g.additive ? 'add' : 'replace');
      latest.current.onSelect(next);
      announce(next);
    } else if (g.kind === 'press-empty' && !cancelled && !readOnly && !g.additive) {
      // Where the button went down: that is the point the user aimed at.
      const res = addPoint(latest.current.doc, xToTime(vp, r, g.x), yToHz(vp, r, g.y), latest.current.grid);
      if (res.added) {
        latest.current.onEdit(res.doc);
        announce(res.doc, 'Added. ');
      } else setStatus(res.reason ?? '');
    } else if (g.kind === 'pan') {
      latest.current.onViewportChange(vpRef.current);
    }
  };

  // Wheel: zoom in time about the pointer; Shift or a sideways wheel pans. Native listener:
  // React's wheel handler is passive and could not stop the page from scrolling.
  useEffect(() => {
    const el = boxRef.current;
    if (!el) return;
    let timer: ReturnType<typeof setTimeout> | null = null;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const b = el.getBoundingClientRect();
      const x = e.clientX - b.left;
      const vp = vpRef.current;
      const r = rectRef.current;
      const sideways = e.shiftKey || Math.abs(e.deltaX) > Math.abs(e.deltaY);
      if (sideways) {
        const d = e.shiftKey ? e.deltaY : e.deltaX;
        vpRef.current = panTime(vp, ((vp.t1 - vp.t0) * d) / r.width);
      } else {
        vpRef.current = zoomTime(vp, Math.exp(-e.deltaY * 0.0015), xToTime(vp, r, x));
      }
      redraw({ bg: true, env: true, over: true });
      // Tell the parent once the wheel rests, not on every notch.
      if (timer) clearTimeout(timer);
      timer = setTimeout(() => latest.current.onViewportChange(vpRef.current), 150);
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => {
      el.removeEventListener('wheel', onWheel);
      if (timer) clearTimeout(timer);
    };
  }, [boxRef, redraw]);

  // --- keyboard ------------------------------------------------------------------------

  const run = (action: EditorAction) => {
    const p = latest.current;
    const d = p.doc;
    const vp = vpRef.current;
    switch (action.type) {
      case 'undo':
        return p.onUndo();
      case 'redo':
        return p.onRedo();
      case 'select-all': {
        const next = selectAll(d);
        p.onSelect(next);
        return announce(next);
      }
      case 'select-none': {
        const next = select(d, []);
        p.onSelect(next);
        return announce(next);
      }
      case 'select-step': {
        const next = selectStep(d, action.by, action.extend);
        p.onSelect(next);
        const k = findKnot(next.segments, next.selection[next.selection.length - 1] ?? '');
        if (k && (k.t < vp.t0 || k.t > vp.t1)) setView(panTime(vp, k.t - (vp.t0 + vp.t1) / 2));
        return announce(next);
      }
      case 'zoom':
        return setView(zoomTime(vp, action.factor));
      case 'pan':
        return setView(panTime(vp, (vp.t1 - vp.t0) * action.fraction));
      case 'fit':
        return setView(fitView(d.segments, p.ceilingHz, p.maxRateHz));
    }
    if (readOnly) return setStatus('This envelope is read-only.');
    switch (action.type) {
      case 'delete': {
        if (d.selection.length === 0) return setStatus('Select a point to remove.');
        const res = deletePoints(d, d.selection);
        if (res.doc !== d) p.onEdit(res.doc);
        return setStatus(res.kept.length ? res.kept[0].reason : `Removed ${d.selection.length} point${d.selection.length > 1 ? 's' : ''}.`);
      }
      case 'nudge': {
        if (d.selection.length === 0) return setStatus('Select a point to move.');
        const next = nudge(d, d.selection, action.direction, action.big, p.grid);
        if (next !== d) p.onEdit(next, `nudge-${nudgeGesture.current}`);
        return announce(next);
      }
      case 'add-after': {
        const res = addPointAfterSelection(d);
        if (res.added) {
          p.onEdit(res.doc);
          return announce(res.doc, 'Added. ');
        }
        return setStatus(res.reason ?? '');
      }
    }
  };

  const onKeyDown = (e: React.KeyboardEvent<HTMLDivElement>) => {
    const action = keyAction(e);
    if (!action) return;
    e.preventDefault();
    run(action);
  };

  const onKeyUp = (e: React.KeyboardEvent<HTMLDivElement>) => {
    // Holding an arrow key is one undo step; the next press starts another.
    if (e.key.startsWith('Arrow')) nudgeGesture.current++;
  };

  return (
    <div>
      <div
        ref={boxRef}
        tabIndex={0}
        role="application"
        aria-label="Envelope editor: rate (Hz) against time (s)"
        aria-describedby={helpId}
        className="relative w-full touch-none select-none rounded-md border border-line bg-panel outline-none focus-visible:ring-2 focus-visible:ring-accent"
        style={{ height, cursor: 'crosshair' }}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={() => finish(false)}
        onPointerCancel={() => finish(true)}
        onKeyDown={onKeyDown}
        onKeyUp={onKeyUp}
      >
        <Stage width={width} height={height} listening={false}>
          <Layer ref={bgLayer} listening={false}>
            <Shape sceneFunc={bgScene} />
          </Layer>
          <Layer ref={envLayer} listening={false}>
            <Shape sceneFunc={envScene} />
          </Layer>
          <Layer ref={overLayer} listening={false}>
            <Shape sceneFunc={overScene} />
          </Layer>
        </Stage>
      </div>
      <p className="mt-1 min-h-5 text-xs text-ink" role="status" aria-live="polite">
        {status}
      </p>
      <details className="mt-1 text-xs text-ink-muted" id={helpId}>
        <summary className="cursor-pointer">Pointer and keys</summary>
        <ul className="mt-1 grid grid-cols-1 gap-x-6 sm:grid-cols-2">
          {KEY_HELP.map(([k, what]) => (
            <li key={k}>
              <span className="font-mono text-ink">{k}</span> — {what}
            </li>
          ))}
        </ul>
      </details>
    </div>
  );
}
