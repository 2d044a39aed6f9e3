import type { Segment } from '@/lib/schedule/spec';
import { createDoc, type EditorDoc } from '@/components/canvas/model';

/** The running example: a cue-paired block that ramps up, holds, then wobbles. */
export const ramp = (durationS: number, fromHz: number, toHz: number): Segment => ({ kind: 'ramp', durationS, fromHz, toHz });
export const hold = (durationS: number, hz: number): Segment => ramp(durationS, hz, hz);
export const sine = (durationS: number, meanHz: number, depthHz: number, freqHz: number, phaseDeg = 0): Segment => ({
  kind: 'sine',
  durationS,
  meanHz,
  depthHz,
  freqHz,
  phaseDeg,
});

export function doc(...segments: Segment[]): EditorDoc {
  return createDoc(segments);
}

/** Evenly spaced probe times over [0, T), skipping exact boundaries where steps are two-valued. */
export function probeTimes(T: number, n = 997): number[] {
  return Array.from({ length: n }, (_, k) => ((k + 0.5) * T) / n);
}
