'use client';
import type { IntervalHistogram as IntervalData } from '@/lib/preview/types';
import { drawAxes, plotRect, xOf, yOf, type AxisSpec } from './axes';
import { PlotStage } from './PlotStage';
import { canvasFont, palette } from './palette';

/** Intervals between pulses within trials, with the absolute refractory period marked. */
export function IntervalHistogram({ intervals }: { intervals: IntervalData }) {
  const { counts, binMs, refractoryMs, overflow, total, meanMs, cv, minMs } = intervals;
  const maxMs = Math.max(counts.length * binMs, refractoryMs * 1.2, binMs);
  const top = Math.max(1, ...counts) * 1.1;
  const summary =
    total === 0
      ? 'Fewer than two pulses in every trial: no intervals.'
      : `${total} intervals; shortest ${minMs!.toFixed(2)} ms, mean ${meanMs!.toFixed(1)} ms, CV ${cv!.toFixed(2)}${overflow ? `; ${overflow} longer than ${maxMs} ms not shown` : ''}.`;
  return (
    <PlotStage
      title="Interval histogram"
      description={`${summary} Refractory period ${refractoryMs} ms.`}
      height={200}
      draw={(ctx, w, h) => {
        const r = plotRect(w, h);
        const x: AxisSpec = { min: 0, max: maxMs, label: 'interval (ms)' };
        const y: AxisSpec = { min: 0, max: top, label: 'intervals', integer: true };
        drawAxes(ctx, r, x, y);
        ctx.save();
        ctx.setAttr('fillStyle', palette.accent);
        counts.forEach((c, k) => {
          if (c === 0) return;
          const x0 = xOf(r, x, k * binMs);
          const x1 = xOf(r, x, (k + 1) * binMs);
          const y0 = yOf(r, y, c);
          ctx.fillRect(x0 + 0.5, y0, Math.max(1, x1 - x0 - 1), r.y + r.height - y0);
        });
        // Refractory: shaded where no interval may fall, and a line at its end.
        const xr = xOf(r, x, refractoryMs);
        ctx.setAttr('fillStyle', palette.danger);
        ctx.setAttr('globalAlpha', 0.08);
        ctx.fillRect(r.x, r.y, xr - r.x, r.height);
        ctx.setAttr('globalAlpha', 1);
        ctx.setAttr('strokeStyle', palette.danger);
        ctx.setAttr('lineWidth', 1.5);
        ctx.setLineDash([4, 3]);
        ctx.beginPath();
        ctx.moveTo(xr, r.y);
        ctx.lineTo(xr, r.y + r.height);
        ctx.stroke();
        ctx.setLineDash([]);
        ctx.setAttr('fillStyle', palette.danger);
        ctx.setAttr('font', canvasFont('sans', 10, 600));
        ctx.setAttr('textAlign', 'left');
        ctx.setAttr('textBaseline', 'top');
        ctx.fillText(`refractory ${refractoryMs} ms`, xr + 4, r.y + 2);
        ctx.restore();
      }}
    >
      <p className="mt-1 text-xs text-ink-muted">{summary}</p>
    </PlotStage>
  );
}
