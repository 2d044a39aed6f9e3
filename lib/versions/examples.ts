import type { Modality } from '@/lib/schedule/spec';
import optical from '@/lib/schedule/examples/optical-ramp-sine.json';
import electrical from '@/lib/schedule/examples/electrical-biphasic.json';

/** The engine's example spec for a modality: where a new protocol starts when no envelope is chosen. */
export function exampleSpecFor(modality: Modality): Record<string, unknown> {
  return structuredClone(modality === 'optical' ? optical : electrical) as Record<string, unknown>;
}
