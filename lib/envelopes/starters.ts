import optical from '@/lib/schedule/examples/optical-ramp-sine.json';
import electrical from '@/lib/schedule/examples/electrical-biphasic.json';
import { parseSpec, type Spec } from '@/lib/schedule/spec';

/** What a new envelope starts from: the engine's own worked examples, one per modality. */
export function starterSpec(modality: 'optical' | 'electrical', seed: string): Spec {
  const parsed = parseSpec({ ...(modality === 'optical' ? optical : electrical), seed });
  if (!parsed.ok) throw new Error(`starter spec is invalid: ${parsed.errors[0]?.path} ${parsed.errors[0]?.message}`);
  return parsed.spec;
}
