import type { Segment, Spec } from '@/lib/schedule/spec';
import { envelopePolyline, segmentStarts } from '@/lib/schedule/envelope';
import type { TracePoint } from './trace';

/** What to do when a trace starts after 0 s: the envelope always starts at 0. */
export type LeadIn = 'shift' | 'hold';

const clean = (x: number) => Math.round(x * 1e9) / 1e9;

/**
 * Breakpoints → ramp segments. Two points at the same time are a step: no segment
 * between them, the next ramp starts from the second value. A trace starting at t0 > 0
 * is either shifted to start at 0, or preceded by a hold of its first rate.
 */
export function pointsToEnvelope(points: readonly TracePoint[], leadIn: LeadIn = 'shift'): Spec['envelope'] {
  const out: Segment[] = [];
  if (points.length < 2) return out;
  const t0 = points[0].t;
  const offset = leadIn === 'shift' ? t0 : 0;
  if (leadIn === 'hold' && t0 > 0) out.push({ kind: 'ramp', durationS: clean(t0), fromHz: points[0].hz, toHz: points[0].hz });
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    const durationS = clean(b.t - offset - (a.t - offset));
    if (durationS > 0) out.push({ kind: 'ramp', durationS, fromHz: a.hz, toHz: b.hz });
  }
  return out;
}

/**
 * Envelope → breakpoints for CSV. Ramps are exact (a step gives two rows at one time);
 * a sine has no exact CSV form, so it is sampled (`pointsPerCycle`) and the spec JSON
 * remains the exact record.
 */
export function envelopeToPoints(envelope: readonly Segment[], pointsPerCycle = 32): TracePoint[] {
  const out: TracePoint[] = [];
  const starts = segmentStarts(envelope);
  envelope.forEach((seg, i) => {
    const part = envelopePolyline([seg], { pointsPerCycle, maxPoints: 1_000_000 });
    for (const p of part) {
      const t = clean(starts[i] + p.t);
      const last = out[out.length - 1];
      // A continuous join repeats the same point: keep one.
      if (last && last.t === t && Math.abs(last.hz - p.hz) < 1e-9) continue;
      out.push({ t, hz: p.hz });
    }
  });
  return out;
}
