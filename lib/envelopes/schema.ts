import { z } from 'zod';

/** Name and description of a saved envelope; shared by the form and the server action. */
export const envelopeDetailsSchema = z.object({
  name: z.string().trim().min(1, 'Give the envelope a name').max(120, 'Keep the name under 120 characters'),
  description: z.string().trim().max(2000, 'Keep the description under 2,000 characters').default(''),
});
export type EnvelopeDetails = z.infer<typeof envelopeDetailsSchema>;

export const envelopeIdSchema = z.object({ id: z.string().uuid('Unknown envelope') });

/** The spec itself is checked by the engine's parseSpec, which reports JSON paths. */
export const saveEnvelopeSpecSchema = envelopeIdSchema.extend({ spec: z.unknown() });

export const newEnvelopeSchema = z.object({
  modality: z.enum(['optical', 'electrical'], { error: 'Pick optical or electrical' }),
});

export const ENVELOPE_SORTS = ['name', 'updated', 'created', 'modality'] as const;
export const envelopeListQuerySchema = z.object({
  q: z.string().trim().max(120).optional().catch(undefined),
  sort: z.enum(ENVELOPE_SORTS).optional().catch(undefined).default('updated'),
  dir: z.enum(['asc', 'desc']).optional().catch(undefined).default('desc'),
});
export type EnvelopeListQuery = z.infer<typeof envelopeListQuerySchema>;
