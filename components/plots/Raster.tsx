'use client';
import { drawAxes, plotRect, xOf, yOf, type AxisSpec } from './axes';
import { PlotStage } from './PlotStage';
import { palette } from './palette';

export interface RasterProps {
  onsetsS: number[][];
  coveredS: number;
}

/** One row per trial, one tick per pulse. */
export function Raster({ onsetsS, coveredS }: RasterProps) {
  const n = onsetsS.length;
  const total = onsetsS.reduce((a, t) => a + t.length, 0);
  const height = Math.min(260, 70 + n * 16);
  return (
    <PlotStage
      title="Raster"
      description={`${n} trials over ${coveredS} s, ${total} pulses in all.`}
      height={height}
      draw={(ctx, w, h) => {
        const r = plotRect(w, h);
        const x: AxisSpec = { min: 0, max: coveredS, label: 'time (s)' };
        const y: AxisSpec = { min: 0.5, max: n + 0.5, label: 'trial', integer: true, ticks: Math.min(n, 6) };
        drawAxes(ctx, r, x, y, { grid: false });
        const rowH = r.height / Math.max(1, n);
        ctx.setAttr('strokeStyle', palette.ink);
        ctx.setAttr('lineWidth', 1);
        ctx.beginPath();
        onsetsS.forEach((trial, i) => {
          const cy = yOf(r, y, i + 1);
          const half = Math.max(2, rowH * 0.38);
          for (const t of trial) {
            const px = Math.round(xOf(r, x, t)) + 0.5;
            ctx.moveTo(px, cy - half);
            ctx.lineTo(px, cy + half);
          }
        });
        ctx.stroke();
      }}
    />
  );
}
