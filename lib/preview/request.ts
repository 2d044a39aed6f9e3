import { z } from 'zod';
import { parseSpec, type Spec, type SpecError } from '@/lib/schedule/spec';

export const PREVIEW_MAX_TRIALS = 20;
export const PREVIEW_DEFAULT_TRIALS = 5;

/**
 * Body of POST /api/preview. The spec is checked by the engine's own parseSpec (not
 * here), so its errors carry the engine's paths (`envelope[3].toHz`) and the editor can
 * place them; this schema only checks the envelope of the request.
 */
export const previewRequestSchema = z.object({
  spec: z.unknown().refine((v) => v !== undefined, { error: 'spec is required' }),
  trials: z
    .number({ error: 'trials must be a number' })
    .int({ error: 'trials must be a whole number' })
    .min(1, { error: 'trials must be ≥ 1' })
    .max(PREVIEW_MAX_TRIALS, { error: `trials must be ≤ ${PREVIEW_MAX_TRIALS}` })
    .default(PREVIEW_DEFAULT_TRIALS),
});

export type PreviewRequest = z.input<typeof previewRequestSchema>;

/** The 400 body: same shape as parseSpec's errors. */
export interface PreviewErrorResponse {
  errors: SpecError[];
}

/**
 * Request body → spec and trial count, or the error list for a 400. Request-level
 * problems are reported at `trials` / `spec`; spec problems at the spec's own paths.
 */
export function parsePreviewRequest(body: unknown): { ok: true; spec: Spec; trials: number } | { ok: false; errors: SpecError[] } {
  const req = previewRequestSchema.safeParse(body);
  if (!req.success) {
    return { ok: false, errors: req.error.issues.map((i) => ({ path: i.path.map(String).join('.') || '$', message: i.message })) };
  }
  const spec = parseSpec(req.data.spec);
  if (!spec.ok) return { ok: false, errors: spec.errors };
  return { ok: true, spec: spec.spec, trials: req.data.trials };
}
