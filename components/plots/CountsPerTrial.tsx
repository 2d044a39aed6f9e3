'use client';
import type { PreviewResponse } from '@/lib/preview/types';
import { drawAxes, drawHLine, plotRect, xOf, yOf, type AxisSpec } from './axes';
import { PlotStage } from './PlotStage';
import { palette } from './palette';

/** Pulses in each trial against the count the envelope asks for and the count expected after refractoriness. */
export function CountsPerTrial({ counts }: { counts: PreviewResponse['counts'] }) {
  const { perTrial, expected, expectedDelivered } = counts;
  const n = perTrial.length;
  const top = Math.max(expected, expectedDelivered, ...perTrial, 1) * 1.15;
  return (
    <PlotStage
      title="Pulses per trial"
      description={`Counts ${perTrial.join(', ')}; envelope expects ${expected.toFixed(1)}, ${expectedDelivered.toFixed(1)} after refractoriness.`}
      height={200}
      draw={(ctx, w, h) => {
        const r = plotRect(w, h);
        const x: AxisSpec = { min: 0.5, max: n + 0.5, label: 'trial', integer: true, ticks: Math.min(n, 10) };
        const y: AxisSpec = { min: 0, max: top, label: 'pulses' };
        drawAxes(ctx, r, x, y);
        const barW = Math.max(2, (r.width / Math.max(1, n)) * 0.6);
        ctx.save();
        ctx.setAttr('fillStyle', palette.estimate);
        perTrial.forEach((c, i) => {
          const cx = xOf(r, x, i + 1);
          const y0 = yOf(r, y, c);
          ctx.fillRect(cx - barW / 2, y0, barW, r.y + r.height - y0);
        });
        ctx.restore();
        drawHLine(ctx, r, yOf(r, y, expected), palette.envelope, `envelope ${expected.toFixed(1)}`);
        if (Math.abs(expectedDelivered - expected) > 1e-9) {
          drawHLine(ctx, r, yOf(r, y, expectedDelivered), palette.warn, `after refractory ${expectedDelivered.toFixed(1)}`, [2, 3], 'left');
        }
      }}
    />
  );
}
