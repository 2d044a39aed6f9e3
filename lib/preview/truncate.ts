import type { Segment } from '@/lib/schedule/spec';
import { segmentRate } from '@/lib/schedule/envelope';

/**
 * The envelope's first `limitS` seconds. The engine draws each 60 s block from its own
 * stream, in time order, so pulses before the cut are the same as in the full schedule:
 * a cut preview shows the real beginning of the real schedule.
 */
export function truncateEnvelope(envelope: readonly Segment[], limitS: number): Segment[] {
  const out: Segment[] = [];
  let t = 0;
  for (const seg of envelope) {
    if (t >= limitS) break;
    if (t + seg.durationS <= limitS) {
      out.push(seg);
    } else {
      const durationS = limitS - t;
      // A sine cut at its end keeps its phase (measured from its start); a ramp ends where its line is.
      out.push(seg.kind === 'ramp' ? { ...seg, durationS, toHz: segmentRate(seg, durationS) } : { ...seg, durationS });
    }
    t += seg.durationS;
  }
  return out;
}
