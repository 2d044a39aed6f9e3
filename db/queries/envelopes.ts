import { and, asc, desc, eq, ilike, isNull, or } from 'drizzle-orm';
import { db } from '../client';
import { envelopes } from '../schema';
import type { EnvelopeListQuery } from '@/lib/envelopes/schema';
import type { Spec } from '@/lib/schedule/spec';

const live = (labId: string) => and(eq(envelopes.labId, labId), isNull(envelopes.deletedAt));

function escapeLike(s: string): string {
  return s.replace(/[\\%_]/g, (c) => `\\${c}`);
}

export async function listEnvelopes({ labId, query }: { labId: string; query: EnvelopeListQuery }) {
  const order = query.dir === 'asc' ? asc : desc;
  const column = { name: envelopes.name, updated: envelopes.updatedAt, created: envelopes.createdAt, modality: envelopes.modality }[query.sort];
  const q = query.q ? `%${escapeLike(query.q)}%` : undefined;
  return db
    .select({
      id: envelopes.id,
      name: envelopes.name,
      description: envelopes.description,
      modality: envelopes.modality,
      createdAt: envelopes.createdAt,
      updatedAt: envelopes.updatedAt,
    })
    .from(envelopes)
    .where(q ? and(live(labId), or(ilike(envelopes.name, q), ilike(envelopes.description, q))) : live(labId))
    .orderBy(order(column), asc(envelopes.id));
}

export async function getEnvelope({ labId, id }: { labId: string; id: string }) {
  const [row] = await db.select().from(envelopes).where(and(live(labId), eq(envelopes.id, id))).limit(1);
  return row ?? null;
}

export async function createEnvelope(args: { labId: string; userId: string; name: string; description: string; spec: Spec; modality: 'optical' | 'electrical' }) {
  const [row] = await db
    .insert(envelopes)
    .values({ labId: args.labId, createdBy: args.userId, name: args.name, description: args.description, spec: args.spec, modality: args.modality })
    .returning({ id: envelopes.id });
  return row!.id;
}

export async function updateEnvelopeSpec({ labId, id, spec, modality }: { labId: string; id: string; spec: Spec; modality: 'optical' | 'electrical' }) {
  const rows = await db
    .update(envelopes)
    .set({ spec, modality, updatedAt: new Date() })
    .where(and(live(labId), eq(envelopes.id, id)))
    .returning({ id: envelopes.id });
  return rows.length === 1;
}

export async function updateEnvelopeDetails({ labId, id, name, description }: { labId: string; id: string; name: string; description: string }) {
  const rows = await db
    .update(envelopes)
    .set({ name, description, updatedAt: new Date() })
    .where(and(live(labId), eq(envelopes.id, id)))
    .returning({ id: envelopes.id });
  return rows.length === 1;
}

/** Soft delete; takes the caller's transaction so the audit row commits with it. */
export async function softDeleteEnvelope({ labId, id }: { labId: string; id: string }, writer: Pick<typeof db, 'update'> = db) {
  const rows = await writer
    .update(envelopes)
    .set({ deletedAt: new Date() })
    .where(and(live(labId), eq(envelopes.id, id)))
    .returning({ id: envelopes.id });
  return rows.length === 1;
}

export async function restoreEnvelope({ labId, id }: { labId: string; id: string }) {
  const rows = await db
    .update(envelopes)
    .set({ deletedAt: null })
    .where(and(eq(envelopes.labId, labId), eq(envelopes.id, id)))
    .returning({ id: envelopes.id });
  return rows.length === 1;
}
