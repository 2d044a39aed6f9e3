import { and, asc, desc, eq, inArray, isNotNull, isNull, ne, sql } from 'drizzle-orm';
import { db } from '../client';
import { protocolVersions, rigTokens, rigs } from '../schema';

export async function listRigs({ labId }: { labId: string }) {
  return db
    .select()
    .from(rigs)
    .where(and(eq(rigs.labId, labId), isNull(rigs.archivedAt)))
    .orderBy(asc(rigs.name));
}

export async function listArchivedRigs({ labId }: { labId: string }) {
  return db
    .select({ id: rigs.id, name: rigs.name, modality: rigs.modality, archivedAt: rigs.archivedAt })
    .from(rigs)
    .where(and(eq(rigs.labId, labId), isNotNull(rigs.archivedAt)))
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

export type RigRow = typeof rigs.$inferSelect;

/** Another live rig of the lab with this name (names are how people tell rigs apart). */
export async function findRigByName({ labId, name, exceptId }: { labId: string; name: string; exceptId?: string }) {
  const [row] = await db
    .select({ id: rigs.id })
    .from(rigs)
    .where(
      and(
        eq(rigs.labId, labId),
        isNull(rigs.archivedAt),
        sql`lower(${rigs.name}) = lower(${name})`,
        exceptId ? ne(rigs.id, exceptId) : undefined,
      ),
    )
    .limit(1);
  return row ?? null;
}

/** How many versions point at the rig, split into those whose spec can still change and those frozen. */
export async function countVersionsOnRig({ labId, rigId }: { labId: string; rigId: string }) {
  const rows = await db
    .select({ status: protocolVersions.status, n: sql<number>`count(*)::int` })
    .from(protocolVersions)
    .where(and(eq(protocolVersions.labId, labId), eq(protocolVersions.rigId, rigId)))
    .groupBy(protocolVersions.status);
  const by = Object.fromEntries(rows.map((r) => [r.status, r.n])) as Partial<Record<string, number>>;
  const total = rows.reduce((s, r) => s + r.n, 0);
  return { total, frozen: (by.in_review ?? 0) + (by.approved ?? 0), approved: by.approved ?? 0 };
}

export type TokenStatus = 'active' | 'revoked' | 'expired';

export function tokenStatus(t: { revokedAt: Date | null; expiresAt: Date }, now = new Date()): TokenStatus {
  if (t.revokedAt) return 'revoked';
  if (t.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'active';
}

/** A rig's tokens, newest first. The hash never leaves the database layer. */
export async function listRigTokens({ labId, rigId }: { labId: string; rigId: string }) {
  const rows = await db
    .select({
      id: rigTokens.id,
      name: rigTokens.name,
      createdAt: rigTokens.createdAt,
      expiresAt: rigTokens.expiresAt,
      lastUsedAt: rigTokens.lastUsedAt,
      revokedAt: rigTokens.revokedAt,
    })
    .from(rigTokens)
    .where(and(eq(rigTokens.labId, labId), eq(rigTokens.rigId, rigId)))
    .orderBy(desc(rigTokens.createdAt));
  const now = new Date();
  return rows.map((r) => ({ ...r, status: tokenStatus(r, now) }));
}

export async function countActiveTokens({ labId, rigIds }: { labId: string; rigIds: string[] }) {
  if (rigIds.length === 0) return new Map<string, number>();
  const rows = await db
    .select({ rigId: rigTokens.rigId, n: sql<number>`count(*)::int` })
    .from(rigTokens)
    .where(
      and(
        eq(rigTokens.labId, labId),
        inArray(rigTokens.rigId, rigIds),
        isNull(rigTokens.revokedAt),
        sql`${rigTokens.expiresAt} > now()`,
      ),
    )
    .groupBy(rigTokens.rigId);
  return new Map(rows.map((r) => [r.rigId, r.n]));
}
