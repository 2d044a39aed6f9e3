/**
 * Form and action inputs for protocols and versions. Shared by the forms (react-hook-form)
 * and the server actions; the spec itself is checked by the engine's own schema.
 */
import { z } from 'zod';
import { VERSION_STATUSES } from './status';

const id = (what: string) => z.string({ error: `${what} is required` }).uuid({ error: `${what} is not a valid id` });
const revision = z.coerce.number({ error: 'revision must be a number' }).int().min(0);

export const protocolFormSchema = z.object({
  name: z.string().trim().min(1, 'Give the protocol a name').max(120, 'Keep the name under 120 characters'),
  purpose: z.string().trim().max(2000, 'Keep the purpose under 2000 characters'),
  modality: z.enum(['optical', 'electrical'], { error: 'Choose optical or electrical' }),
  target: z.string().trim().max(200, 'Keep the target under 200 characters'),
  rigIds: z.array(id('rig')).min(1, 'Choose at least one rig this protocol may run on'),
  /** "example" for the engine's example spec of the modality, or an envelope id of the lab. */
  startFrom: z.union([z.literal('example'), id('envelope')], { error: 'Choose where the first version starts from' }),
});
export type ProtocolFormInput = z.infer<typeof protocolFormSchema>;

export const draftSpecSchema = z.object({
  versionId: id('version'),
  // Checked by the engine's parser in the workflow, which reports paths like envelope[2].toHz.
  spec: z.unknown(),
});

export const draftRigSchema = z.object({ versionId: id('version'), rigId: id('rig') });

export const submitSchema = z.object({
  versionId: id('version'),
  revision,
  justification: z.string().trim().max(4000, 'Keep the justification under 4000 characters').default(''),
});
export type SubmitInput = z.infer<typeof submitSchema>;

export const decisionSchema = z
  .object({
    versionId: id('version'),
    revision,
    decision: z.enum(['approve', 'return'], { error: 'Choose approve or return' }),
    comment: z.string().trim().max(4000, 'Keep the comment under 4000 characters').default(''),
  })
  .refine((d) => d.decision !== 'return' || d.comment.length > 0, {
    path: ['comment'],
    message: 'Say what needs to change before it can be approved',
  });
export type DecisionInput = z.infer<typeof decisionSchema>;

export const withdrawSchema = z.object({
  versionId: id('version'),
  revision,
  reason: z.string().trim().min(1, 'Say why it is withdrawn').max(2000, 'Keep the reason under 2000 characters'),
});

export const copySchema = z.object({ versionId: id('version') });

export const QUEUE_SORTS = ['submitted', 'protocol', 'author', 'rig', 'status'] as const;
export const QUEUE_PAGE_SIZE = 20;

/** The review queue's search params; anything unreadable falls back to the default view. */
export const queueQuerySchema = z.object({
  status: z.enum([...VERSION_STATUSES, 'all']).catch('in_review').default('in_review'),
  rig: z.string().uuid().optional().catch(undefined),
  author: z.string().uuid().optional().catch(undefined),
  sort: z.enum(QUEUE_SORTS).catch('submitted').default('submitted'),
  dir: z.enum(['asc', 'desc']).catch('asc').default('asc'),
  page: z.coerce.number().int().min(1).catch(1).default(1),
});
export type QueueQuery = z.infer<typeof queueQuerySchema>;

/** Two version numbers of one protocol to compare. */
export const compareQuerySchema = z.object({
  a: z.coerce.number().int().min(1),
  b: z.coerce.number().int().min(1),
});
