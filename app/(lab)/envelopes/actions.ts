'use server';

import { randomBytes } from 'node:crypto';
import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { db } from '@/db/client';
import { recordAudit } from '@/db/queries/audit';
import {
  createEnvelope,
  getEnvelope,
  restoreEnvelope,
  softDeleteEnvelope,
  updateEnvelopeDetails,
  updateEnvelopeSpec,
} from '@/db/queries/envelopes';
import { memberAction } from '@/lib/auth/guard';
import { envelopeDetailsSchema, envelopeIdSchema, newEnvelopeSchema, saveEnvelopeSpecSchema } from '@/lib/envelopes/schema';
import { starterSpec } from '@/lib/envelopes/starters';
import { badRequest, notFound } from '@/lib/http/errors';
import { modalityOf, parseSpec } from '@/lib/schedule/spec';

export const newEnvelope = memberAction('envelopes.edit', newEnvelopeSchema, async ({ modality }, member) => {
  const spec = starterSpec(modality, `seed-${randomBytes(4).toString('hex')}`);
  const id = await createEnvelope({
    labId: member.lab.id,
    userId: member.user.id,
    name: `Untitled ${modality} envelope`,
    description: '',
    spec,
    modality,
  });
  return { id };
});

export const saveEnvelopeSpec = memberAction('envelopes.edit', saveEnvelopeSpecSchema, async ({ id, spec }, member) => {
  const parsed = parseSpec(spec);
  // The engine's own validation, with its JSON paths, so the editor can point at each problem.
  if (!parsed.ok) throw badRequest('The envelope is not valid yet.', parsed.errors.map((e) => ({ path: `spec.${e.path}`, message: e.message })));
  const ok = await updateEnvelopeSpec({ labId: member.lab.id, id, spec: parsed.spec, modality: modalityOf(parsed.spec) });
  if (!ok) throw notFound('This envelope no longer exists.');
  revalidatePath('/envelopes');
  return undefined;
});

export const saveEnvelopeDetails = memberAction(
  'envelopes.edit',
  envelopeIdSchema.extend(envelopeDetailsSchema.shape),
  async ({ id, name, description }, member) => {
    if (!(await updateEnvelopeDetails({ labId: member.lab.id, id, name, description }))) throw notFound('This envelope no longer exists.');
    revalidatePath('/envelopes');
    revalidatePath(`/envelopes/${id}`);
    return undefined;
  },
);

export const duplicateEnvelope = memberAction('envelopes.edit', envelopeIdSchema, async ({ id }, member) => {
  const source = await getEnvelope({ labId: member.lab.id, id });
  if (!source) throw notFound('This envelope no longer exists.');
  const copy = await createEnvelope({
    labId: member.lab.id,
    userId: member.user.id,
    name: `${source.name} (copy)`.slice(0, 120),
    description: source.description,
    spec: source.spec as never,
    modality: source.modality,
  });
  revalidatePath('/envelopes');
  return { id: copy };
});

export const deleteEnvelope = memberAction('envelopes.edit', envelopeIdSchema, async ({ id }, member) => {
  await db.transaction(async (tx) => {
    if (!(await softDeleteEnvelope({ labId: member.lab.id, id }, tx))) throw notFound('This envelope no longer exists.');
    await recordAudit(tx, {
      labId: member.lab.id,
      actor: { userId: member.user.id, label: member.user.email },
      action: 'envelope.deleted',
      subjectType: 'envelope',
      subjectId: id,
    });
  });
  revalidatePath('/envelopes');
  return undefined;
});

export const undoDeleteEnvelope = memberAction('envelopes.edit', envelopeIdSchema, async ({ id }, member) => {
  if (!(await restoreEnvelope({ labId: member.lab.id, id }))) throw notFound('This envelope no longer exists.');
  revalidatePath('/envelopes');
  return undefined;
});

/** Form-friendly wrappers: redirect after success (outside try, since redirect throws). */
export async function newEnvelopeAndOpen(form: FormData) {
  const res = await newEnvelope(form);
  if (res.ok) redirect(`/envelopes/${res.data.id}`);
}

export async function duplicateAndOpen(form: FormData) {
  const res = await duplicateEnvelope(form);
  if (res.ok) redirect(`/envelopes/${res.data.id}`);
}

export async function deleteAndReturn(form: FormData) {
  const res = await deleteEnvelope(form);
  if (res.ok) redirect(`/envelopes?deleted=${String(form.get('id'))}`);
}

export async function undoDeleteAndOpen(form: FormData) {
  const res = await undoDeleteEnvelope(form);
  if (res.ok) redirect(`/envelopes/${String(form.get('id'))}`);
}
