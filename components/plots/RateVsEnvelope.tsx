'use client';
import type { PreviewResponse } from '@/lib/preview/types';
import { drawAxes, drawHLine, plotRect, xOf, yOf, type AxisSpec } from './axes';
import { PlotStage } from './PlotStage';
import { palette } from './palette';

export interface RateVsEnvelopeProps {
  preview: Pick<PreviewResponse, 'rate' | 'envelope' | 'coveredS' | 'ceilingHz' | 'maxRateHz' | 'trials'>;
}

/** The rate estimated from the generated trials, with its 95 % band, over the drawn envelope. */
export function RateVsEnvelope({ preview }: RateVsEnvelopeProps) {
  const { rate, envelope, coveredS, ceilingHz, maxRateHz, trials } = preview;
  const top = Math.max(...envelope.hz, ...rate.upperHz, maxRateHz ?? 0, 1) * 1.08;
  return (
    <PlotStage
      title="Rate across trials vs envelope"
      description={`Estimate from ${trials} trials in ${rate.binS} s bins with a 95 % band, drawn over the envelope (peak ${Math.max(...envelope.hz).toFixed(1)} Hz).`}
      height={220}
      draw={(ctx, w, h) => {
        const r = plotRect(w, h);
        const x: AxisSpec = { min: 0, max: coveredS, label: 'time (s)' };
        const y: AxisSpec = { min: 0, max: top, label: 'rate (Hz)' };
        drawAxes(ctx, r, x, y);

        // Band: one rectangle per bin, so it reads as a bin-wise interval, not a smooth curve.
        ctx.save();
        ctx.setAttr('fillStyle', palette.estimate);
        ctx.setAttr('globalAlpha', 0.16);
        for (let k = 0; k < rate.hz.length; k++) {
          const x0 = xOf(r, x, rate.start[k]);
          const x1 = xOf(r, x, rate.start[k] + rate.width[k]);
          const y0 = yOf(r, y, Math.min(rate.upperHz[k], top));
          const y1 = yOf(r, y, rate.lowerHz[k]);
          ctx.fillRect(x0, y0, x1 - x0, y1 - y0);
        }
        ctx.restore();

        ctx.save();
        ctx.setAttr('strokeStyle', palette.estimate);
        ctx.setAttr('lineWidth', 1.5);
        ctx.beginPath();
        for (let k = 0; k < rate.hz.length; k++) {
          const py = yOf(r, y, rate.hz[k]);
          const x0 = xOf(r, x, rate.start[k]);
          if (k === 0) ctx.moveTo(x0, py);
          else ctx.lineTo(x0, py);
          ctx.lineTo(xOf(r, x, rate.start[k] + rate.width[k]), py);
        }
        ctx.stroke();

        ctx.setAttr('strokeStyle', palette.envelope);
        ctx.setAttr('lineWidth', 2);
        ctx.beginPath();
        envelope.t.forEach((t, i) => {
          const px = xOf(r, x, t);
          const py = yOf(r, y, envelope.hz[i]);
          if (i === 0) ctx.moveTo(px, py);
          else ctx.lineTo(px, py);
        });
        ctx.stroke();
        ctx.restore();

        drawHLine(ctx, r, yOf(r, y, ceilingHz), palette.danger, `ceiling ${ceilingHz} Hz`);
        if (maxRateHz !== null) drawHLine(ctx, r, yOf(r, y, maxRateHz), palette.warn, `rate cap ${maxRateHz} Hz`, [2, 3], 'left');

      }}
    >
      <p className="mt-1 flex flex-wrap gap-x-4 text-xs text-ink">
        <span className="inline-flex items-center gap-1.5">
          <span className="inline-block h-0.5 w-4" style={{ background: palette.envelope }} aria-hidden /> envelope (drawn)
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span className="inline-block h-2.5 w-4" style={{ background: palette.estimate, opacity: 0.35 }} aria-hidden /> estimate with 95 % band
        </span>
      </p>
      <p className="mt-1 text-xs text-ink-muted">{rate.method}</p>
    </PlotStage>
  );
}
