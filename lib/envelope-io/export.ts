import type { Segment, Spec } from '@/lib/schedule/spec';
import { envelopeToPoints } from './points';

/** `time_s,rate_hz` with a header, one breakpoint per line; reads back with parseEnvelopeCsv. */
export function envelopeToCsv(envelope: readonly Segment[], opts: { pointsPerCycle?: number } = {}): string {
  const lines = ['time_s,rate_hz'];
  for (const p of envelopeToPoints(envelope, opts.pointsPerCycle)) lines.push(`${num(p.t)},${num(p.hz)}`);
  return `${lines.join('\n')}\n`;
}

/** The spec as the exact, shareable record (sines stay sines). Two-space indent for diffs. */
export function envelopeToSpecJson(spec: Spec): string {
  return `${JSON.stringify(spec, null, 2)}\n`;
}

/** Enough digits to round-trip a double, without exponent noise for ordinary values. */
function num(x: number): string {
  const short = Number(x.toPrecision(12));
  return String(Math.abs(short - x) <= Math.abs(x) * 1e-12 ? short : x);
}
