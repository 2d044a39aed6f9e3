import 'server-only';
import { and, asc, desc, eq, inArray, lt, max, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '../client';
import { auditLog, memberships, protocolVersions, protocols, reviewComments, rigs, users, type VersionStatus } from '../schema';
import type { Conn, Tx } from './protocols';
import { QUEUE_PAGE_SIZE, type QueueQuery } from '@/lib/versions/schemas';

const author = alias(users, 'author');
const decider = alias(users, 'decider');

const versionColumns = {
  id: protocolVersions.id,
  labId: protocolVersions.labId,
  protocolId: protocolVersions.protocolId,
  protocolName: protocols.name,
  modality: protocols.modality,
  number: protocolVersions.number,
  status: protocolVersions.status,
  spec: protocolVersions.spec,
  rigId: protocolVersions.rigId,
  rigName: rigs.name,
  rigClockHz: rigs.clockHz,
  rigArchivedAt: rigs.archivedAt,
  checksum: protocolVersions.checksum,
  approvedChecksum: protocolVersions.approvedChecksum,
  justification: protocolVersions.justification,
  authorId: protocolVersions.authorId,
  authorName: author.name,
  authorEmail: author.email,
  submittedAt: protocolVersions.submittedAt,
  decidedBy: protocolVersions.decidedBy,
  deciderName: decider.name,
  deciderEmail: decider.email,
  decidedAt: protocolVersions.decidedAt,
  copiedFromId: protocolVersions.copiedFromId,
  revision: protocolVersions.revision,
  createdAt: protocolVersions.createdAt,
  updatedAt: protocolVersions.updatedAt,
};

function selectVersions(conn: Conn) {
  return conn
    .select(versionColumns)
    .from(protocolVersions)
    .innerJoin(protocols, and(eq(protocols.id, protocolVersions.protocolId), eq(protocols.labId, protocolVersions.labId)))
    .leftJoin(rigs, eq(rigs.id, protocolVersions.rigId))
    .leftJoin(author, eq(author.id, protocolVersions.authorId))
    .leftJoin(decider, eq(decider.id, protocolVersions.decidedBy));
}

export type VersionRow = NonNullable<Awaited<ReturnType<typeof getVersion>>>;

export async function getVersion({ labId, versionId }: { labId: string; versionId: string }, conn: Conn = db) {
  const [row] = await selectVersions(conn)
    .where(and(eq(protocolVersions.labId, labId), eq(protocolVersions.id, versionId)))
    .limit(1);
  return row ?? null;
}

export async function getVersionByNumber({ labId, protocolId, number }: { labId: string; protocolId: string; number: number }) {
  const [row] = await selectVersions(db)
    .where(and(eq(protocolVersions.labId, labId), eq(protocolVersions.protocolId, protocolId), eq(protocolVersions.number, number)))
    .limit(1);
  return row ?? null;
}

export async function listVersions({ labId, protocolId }: { labId: string; protocolId: string }) {
  return selectVersions(db)
    .where(and(eq(protocolVersions.labId, labId), eq(protocolVersions.protocolId, protocolId)))
    .orderBy(desc(protocolVersions.number));
}

/** The approved version a new one is compared with: the latest approved one numbered below it. */
export async function lastApprovedBefore({ labId, protocolId, number }: { labId: string; protocolId: string; number: number }) {
  const [row] = await selectVersions(db)
    .where(
      and(
        eq(protocolVersions.labId, labId),
        eq(protocolVersions.protocolId, protocolId),
        eq(protocolVersions.status, 'approved'),
        lt(protocolVersions.number, number),
      ),
    )
    .orderBy(desc(protocolVersions.number))
    .limit(1);
  return row ?? null;
}

const QUEUE_ORDER = {
  submitted: protocolVersions.submittedAt,
  protocol: protocols.name,
  author: author.name,
  rig: rigs.name,
  status: protocolVersions.status,
} as const;

/** The review queue: one page of versions with the filters and order asked for, and the total. */
export async function listReviewQueue({ labId, query }: { labId: string; query: QueueQuery }) {
  const where: SQL[] = [eq(protocolVersions.labId, labId)];
  // Drafts belong to their authors until submitted; the queue shows everything from submission on.
  if (query.status === 'all') where.push(sql`${protocolVersions.status} <> 'draft'`);
  else where.push(eq(protocolVersions.status, query.status));
  if (query.rig) where.push(eq(protocolVersions.rigId, query.rig));
  if (query.author) where.push(eq(protocolVersions.authorId, query.author));
  const order = query.dir === 'asc' ? asc : desc;
  const rows = await db
    .select({
      id: protocolVersions.id,
      protocolId: protocolVersions.protocolId,
      protocolName: protocols.name,
      modality: protocols.modality,
      number: protocolVersions.number,
      status: protocolVersions.status,
      rigName: rigs.name,
      authorId: protocolVersions.authorId,
      authorName: author.name,
      authorEmail: author.email,
      submittedAt: protocolVersions.submittedAt,
      decidedAt: protocolVersions.decidedAt,
      justified: sql<boolean>`${protocolVersions.justification} is not null`,
      total: sql<number>`count(*) over ()`.mapWith(Number),
    })
    .from(protocolVersions)
    .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
    .leftJoin(rigs, eq(rigs.id, protocolVersions.rigId))
    .leftJoin(author, eq(author.id, protocolVersions.authorId))
    .where(and(...where))
    .orderBy(order(QUEUE_ORDER[query.sort]), asc(protocolVersions.submittedAt), asc(protocolVersions.id))
    .limit(QUEUE_PAGE_SIZE)
    .offset((query.page - 1) * QUEUE_PAGE_SIZE);
  return { rows, total: rows[0]?.total ?? (query.page > 1 ? await countQueue(where) : 0) };
}

async function countQueue(where: SQL[]) {
  const [row] = await db
    .select({ n: sql<number>`count(*)`.mapWith(Number) })
    .from(protocolVersions)
    .leftJoin(author, eq(author.id, protocolVersions.authorId))
    .where(and(...where));
  return row?.n ?? 0;
}

/** Rigs and authors that appear on submitted versions: the queue's filter choices. */
export async function queueFilterOptions({ labId }: { labId: string }) {
  const submitted = and(eq(protocolVersions.labId, labId), sql`${protocolVersions.status} <> 'draft'`);
  const [rigRows, authorRows] = await Promise.all([
    db
      .selectDistinct({ id: rigs.id, name: rigs.name })
      .from(protocolVersions)
      .innerJoin(rigs, eq(rigs.id, protocolVersions.rigId))
      .where(submitted)
      .orderBy(rigs.name),
    db
      .selectDistinct({ id: users.id, name: users.name, email: users.email })
      .from(protocolVersions)
      .innerJoin(users, eq(users.id, protocolVersions.authorId))
      .where(submitted)
      .orderBy(users.name),
  ]);
  return { rigs: rigRows, authors: authorRows };
}

export async function listComments({ labId, versionIds }: { labId: string; versionIds: string[] }) {
  if (versionIds.length === 0) return [];
  return db
    .select({
      id: reviewComments.id,
      versionId: reviewComments.versionId,
      decision: reviewComments.decision,
      body: reviewComments.body,
      createdAt: reviewComments.createdAt,
      authorName: users.name,
      authorEmail: users.email,
    })
    .from(reviewComments)
    .leftJoin(users, eq(users.id, reviewComments.authorId))
    .where(and(eq(reviewComments.labId, labId), inArray(reviewComments.versionId, versionIds)))
    .orderBy(asc(reviewComments.createdAt));
}

/** Audit actions that make someone a contributor of a version (see contributorsOf). */
export const CONTRIBUTING_ACTIONS = ['version.created', 'version.copied', 'version.saved', 'version.rig_set', 'version.submitted'] as const;

/**
 * Everyone who wrote, edited or submitted a version: its author plus the actors of the
 * append-only audit rows for those actions. Separation of duties reads this set.
 */
export async function contributorsOf({ labId, versionId, authorId }: { labId: string; versionId: string; authorId: string | null }, conn: Conn = db) {
  const rows = await conn
    .selectDistinct({ userId: auditLog.actorUserId })
    .from(auditLog)
    .where(
      and(
        eq(auditLog.labId, labId),
        eq(auditLog.subjectType, 'protocol_version'),
        eq(auditLog.subjectId, versionId),
        inArray(auditLog.action, [...CONTRIBUTING_ACTIONS]),
      ),
    );
  const ids = new Set(rows.map((r) => r.userId).filter((x): x is string => Boolean(x)));
  if (authorId) ids.add(authorId);
  return ids;
}

/** The submitter of a version, from the audit log (null when it was never submitted). */
export async function submitterOf({ labId, versionId }: { labId: string; versionId: string }, conn: Conn = db) {
  const [row] = await conn
    .select({ userId: auditLog.actorUserId, email: users.email, name: users.name })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorUserId))
    .where(
      and(eq(auditLog.labId, labId), eq(auditLog.subjectType, 'protocol_version'), eq(auditLog.subjectId, versionId), eq(auditLog.action, 'version.submitted')),
    )
    .orderBy(desc(auditLog.id))
    .limit(1);
  return row ?? null;
}

export async function safetyOfficersOf({ labId }: { labId: string }, conn: Conn = db) {
  return conn
    .select({ id: users.id, email: users.email, name: users.name })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.labId, labId), sql`'safety_officer' = any(${memberships.roles})`))
    .orderBy(users.email);
}

export async function insertVersion(
  tx: Tx,
  v: { labId: string; protocolId: string; number: number; spec: unknown; rigId: string | null; authorId: string; copiedFromId?: string | null },
) {
  const [row] = await tx
    .insert(protocolVersions)
    .values({ ...v, status: 'draft', copiedFromId: v.copiedFromId ?? null })
    .returning({ id: protocolVersions.id, number: protocolVersions.number, revision: protocolVersions.revision });
  return row!;
}

export async function nextVersionNumber(tx: Tx, { labId, protocolId }: { labId: string; protocolId: string }) {
  const [row] = await tx
    .select({ n: max(protocolVersions.number) })
    .from(protocolVersions)
    .where(and(eq(protocolVersions.labId, labId), eq(protocolVersions.protocolId, protocolId)));
  return (row?.n ?? 0) + 1;
}

/** Changes a draft's spec or rig; null when it is no longer a draft (someone submitted it). */
export async function updateDraft(
  tx: Tx,
  { labId, versionId, set }: { labId: string; versionId: string; set: { spec?: unknown; rigId?: string } },
) {
  const [row] = await tx
    .update(protocolVersions)
    .set({ ...set, revision: sql`${protocolVersions.revision} + 1`, updatedAt: new Date() })
    .where(and(eq(protocolVersions.labId, labId), eq(protocolVersions.id, versionId), eq(protocolVersions.status, 'draft')))
    .returning({ revision: protocolVersions.revision });
  return row ?? null;
}

type TransitionSet = {
  status: VersionStatus;
  checksum?: string;
  pulseCount?: number | null;
  justification?: string | null;
  submittedAt?: Date;
  decidedBy?: string;
  decidedAt?: Date;
  approvedChecksum?: string;
};

/**
 * The optimistic-concurrency step of every state change: it matches only the revision
 * and state the caller read. Two people acting at once both aim at the same revision;
 * the row lock makes the second wait for the first, then match nothing. Null ⇒ lost.
 */
export async function transitionVersion(
  tx: Tx,
  { labId, versionId, revision, from, set }: { labId: string; versionId: string; revision: number; from: VersionStatus; set: TransitionSet },
) {
  const [row] = await tx
    .update(protocolVersions)
    .set({ ...set, revision: sql`${protocolVersions.revision} + 1`, updatedAt: new Date() })
    .where(
      and(
        eq(protocolVersions.labId, labId),
        eq(protocolVersions.id, versionId),
        eq(protocolVersions.revision, revision),
        eq(protocolVersions.status, from),
      ),
    )
    .returning({ id: protocolVersions.id, status: protocolVersions.status, revision: protocolVersions.revision });
  return row ?? null;
}

export async function insertComment(
  tx: Tx,
  v: { labId: string; versionId: string; authorId: string; decision: string | null; body: string },
) {
  await tx.insert(reviewComments).values(v);
}
