import { SPEC_FORMAT, parseSpec, type Spec, type SpecError } from '@/lib/schedule/spec';

/** Everything in a spec except its envelope: the small settings form beside the editor. */
export type SpecSettings = Omit<Spec, 'format' | 'envelope'>;

export function splitSpec(spec: Spec): { envelope: Spec['envelope']; settings: SpecSettings } {
  const { format: _format, envelope, ...settings } = spec;
  return { envelope, settings };
}

export function joinSpec(envelope: Spec['envelope'], settings: SpecSettings): Spec {
  return { format: SPEC_FORMAT, envelope, ...settings };
}

/** Reasons saving is blocked right now; empty when the spec is valid. */
export function saveBlockers(spec: Spec): SpecError[] {
  const r = parseSpec(spec);
  return r.ok ? [] : r.errors;
}

/**
 * A fresh seed: 'seed-' and 10 base-36 characters from the platform's cryptographic
 * source (about 51 bits, plenty to tell sessions apart; the seed is a label, not a secret).
 */
export function newSeed(randomValues: (a: Uint32Array) => Uint32Array = (a) => globalThis.crypto.getRandomValues(a)): string {
  const words = randomValues(new Uint32Array(2));
  const text = (words[0].toString(36) + words[1].toString(36)).padStart(10, '0').slice(-10);
  return `seed-${text}`;
}
