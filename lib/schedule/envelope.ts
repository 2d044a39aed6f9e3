/**
 * Rate envelope math: ρ(t) for back-to-back ramp and sine segments.
 *
 * Browser-safe (the envelope editor imports it): no node: imports.
 *
 * Segment time is local: a sine's phase is measured from the segment's own start,
 * so moving or editing one segment never shifts the waveform of another.
 *   ramp: ρ(t) = fromHz + (toHz − fromHz)·t/durationS
 *   sine: ρ(t) = meanHz + depthHz·sin(2π·freqHz·t + phaseDeg·π/180)
 */
import type { RampSegment, Segment, SineSegment } from './spec';

const TWO_PI = 2 * Math.PI;
const DEG = Math.PI / 180;

/** Segment start times; starts[i] is where segment i begins, starts[n] = T. */
export function segmentStarts(envelope: readonly Segment[]): Float64Array {
  const starts = new Float64Array(envelope.length + 1);
  // Left-to-right summation, always in this order: boundaries must be bit-identical
  // everywhere the engine and the editor compute them.
  for (let i = 0; i < envelope.length; i++) starts[i + 1] = starts[i] + envelope[i].durationS;
  return starts;
}

export function envelopeDuration(envelope: readonly Segment[]): number {
  let t = 0;
  for (const seg of envelope) t += seg.durationS;
  return t;
}

/** ρ at local time `local` (seconds from the segment's start). */
export function segmentRate(seg: Segment, local: number): number {
  if (seg.kind === 'ramp') return seg.fromHz + (seg.toHz - seg.fromHz) * (local / seg.durationS);
  return seg.meanHz + seg.depthHz * Math.sin(TWO_PI * seg.freqHz * local + seg.phaseDeg * DEG);
}

/** Index of the segment holding t (last segment for t ≥ T, first for t < 0). */
export function segmentIndexAt(starts: Float64Array, t: number): number {
  const n = starts.length - 1;
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid] <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** ρ(t) in Hz; 0 outside [0, T). */
export function rateAt(envelope: readonly Segment[], t: number): number {
  if (envelope.length === 0 || !(t >= 0)) return 0;
  const starts = segmentStarts(envelope);
  if (t >= starts[envelope.length]) return 0;
  const i = segmentIndexAt(starts, t);
  return segmentRate(envelope[i], t - starts[i]);
}

/** ∫ρ over local [a, b] of one segment, closed form. */
export function segmentIntegral(seg: Segment, a: number, b: number): number {
  if (b <= a) return 0;
  if (seg.kind === 'ramp') {
    const slope = (seg.toHz - seg.fromHz) / seg.durationS;
    return seg.fromHz * (b - a) + 0.5 * slope * (b * b - a * a);
  }
  const w = TWO_PI * seg.freqHz;
  const phi = seg.phaseDeg * DEG;
  return seg.meanHz * (b - a) - (seg.depthHz / w) * (Math.cos(w * b + phi) - Math.cos(w * a + phi));
}

/** ∫ρ dt over [t0, t1] (clipped to [0, T]), exact closed form per segment. */
export function integrateEnvelope(envelope: readonly Segment[], t0: number, t1: number): number {
  if (envelope.length === 0) return 0;
  const starts = segmentStarts(envelope);
  const lo = Math.max(0, t0);
  const hi = Math.min(starts[envelope.length], t1);
  if (!(hi > lo)) return 0;
  let sum = 0;
  for (let i = segmentIndexAt(starts, lo); i < envelope.length && starts[i] < hi; i++) {
    const a = Math.max(lo, starts[i]) - starts[i];
    const b = Math.min(hi, starts[i + 1]) - starts[i];
    sum += segmentIntegral(envelope[i], a, b);
  }
  return sum;
}

/** Exact [min, max] of ρ over one segment, including sine peaks and troughs inside it. */
export function segmentRange(seg: Segment): { min: number; max: number } {
  if (seg.kind === 'ramp') return rampRange(seg);
  return sineRange(seg);
}

function rampRange(seg: RampSegment) {
  return { min: Math.min(seg.fromHz, seg.toHz), max: Math.max(seg.fromHz, seg.toHz) };
}

function sineRange(seg: SineSegment) {
  const w = TWO_PI * seg.freqHz;
  const th0 = seg.phaseDeg * DEG;
  const th1 = th0 + w * seg.durationS;
  const end0 = seg.meanHz + seg.depthHz * Math.sin(th0);
  const end1 = seg.meanHz + seg.depthHz * Math.sin(th1);
  let min = Math.min(end0, end1);
  let max = Math.max(end0, end1);
  if (reachesAngle(th0, th1, Math.PI / 2)) max = seg.meanHz + seg.depthHz;
  if (reachesAngle(th0, th1, (3 * Math.PI) / 2)) min = seg.meanHz - seg.depthHz;
  return { min, max };
}

/** Does [th0, th1] contain target + 2πk for some integer k? */
function reachesAngle(th0: number, th1: number, target: number): boolean {
  const k = Math.ceil((th0 - target) / TWO_PI);
  return target + k * TWO_PI <= th1;
}

/** Exact maximum of ρ over [0, T]. */
export function envelopeMax(envelope: readonly Segment[]): number {
  let max = 0;
  for (const seg of envelope) max = Math.max(max, segmentRange(seg).max);
  return max;
}

/** Exact minimum of ρ over [0, T]. */
export function envelopeMin(envelope: readonly Segment[]): number {
  let min = Infinity;
  for (const seg of envelope) min = Math.min(min, segmentRange(seg).min);
  return envelope.length ? min : 0;
}

export interface EnvelopePoint {
  t: number;
  hz: number;
}

/**
 * Polyline for plots. Ramps are exact with two vertices; sines get `pointsPerCycle`
 * points per cycle so peaks are not cut. `maxPoints` bounds the total so a 24 h envelope
 * cannot freeze the editor: when it binds, sines share what is left after every segment's
 * minimum (2 points per ramp, 3 per sine) and show an outline rather than every cycle.
 */
export function envelopePolyline(
  envelope: readonly Segment[],
  opts: { pointsPerCycle?: number; maxPoints?: number } = {},
): EnvelopePoint[] {
  const perCycle = opts.pointsPerCycle ?? 24;
  const maxPoints = opts.maxPoints ?? 20_000;
  const starts = segmentStarts(envelope);
  const wanted = envelope.map((seg) => (seg.kind === 'ramp' ? 2 : Math.max(3, Math.ceil(seg.freqHz * seg.durationS * perCycle) + 1)));
  const floor = envelope.reduce((n, seg) => n + (seg.kind === 'ramp' ? 2 : 3), 0);
  const extraWanted = wanted.reduce((n, w, i) => n + w - (envelope[i].kind === 'ramp' ? 2 : 3), 0);
  const total = floor + extraWanted;
  const share = total > maxPoints && extraWanted > 0 ? Math.max(0, maxPoints - floor) / extraWanted : 1;
  const out: EnvelopePoint[] = [];
  envelope.forEach((seg, i) => {
    const points = seg.kind === 'ramp' ? 2 : 3 + Math.floor((wanted[i] - 3) * share);
    const n = points - 1;
    for (let k = 0; k <= n; k++) {
      const local = (seg.durationS * k) / n;
      out.push({ t: starts[i] + local, hz: segmentRate(seg, local) });
    }
  });
  return out;
}

/** ρ on a uniform grid of `n` points over [0, T) (for rate-vs-envelope overlays). */
export function sampleEnvelope(envelope: readonly Segment[], n: number): EnvelopePoint[] {
  const starts = segmentStarts(envelope);
  const T = starts[envelope.length];
  const out: EnvelopePoint[] = [];
  let i = 0;
  for (let k = 0; k < n; k++) {
    const t = (T * k) / n;
    while (i < envelope.length - 1 && starts[i + 1] <= t) i++;
    out.push({ t, hz: segmentRate(envelope[i], t - starts[i]) });
  }
  return out;
}
