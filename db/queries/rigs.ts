import { and, asc, eq, isNull } from 'drizzle-orm';
import { db } from '../client';
import { rigs } from '../schema';

export async function listRigs({ labId }: { labId: string }) {
  return db
    .select()
    .from(rigs)
    .where(and(eq(rigs.labId, labId), isNull(rigs.archivedAt)))
    .orderBy(asc(rigs.name));
}

export async function getRig({ labId, rigId }: { labId: string; rigId: string }) {
  const [row] = await db
    .select()
    .from(rigs)
    .where(and(eq(rigs.labId, labId), eq(rigs.id, rigId)))
    .limit(1);
  return row ?? null;
}
