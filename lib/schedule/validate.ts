/** The engine never runs on a spec that has not passed the shared schema. */
import { parseSpec, type Spec, type SpecError } from './spec';

export class SpecInvalidError extends Error {
  constructor(readonly errors: SpecError[]) {
    super(`invalid spec: ${errors.map((e) => `${e.path}: ${e.message}`).join('; ')}`);
    this.name = 'SpecInvalidError';
  }
}

export function assertValid(spec: unknown): asserts spec is Spec {
  const r = parseSpec(spec);
  if (!r.ok) throw new SpecInvalidError(r.errors);
}
