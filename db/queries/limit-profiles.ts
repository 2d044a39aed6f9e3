import 'server-only';
import { and, asc, eq, isNull, ne, sql } from 'drizzle-orm';
import { db } from '../client';
import { labs, limitProfiles, rigs, users } from '../schema';
import { recordAudit } from './audit';
import { fromLimitColumns, toLimitColumns } from './limit-profile-shape';
import { limitProfileSchema, type LimitProfile } from '@/lib/safety';
import { describeChanges } from '@/lib/audit/diff';
import { badRequest, conflict, notFound, zodIssues } from '@/lib/http/errors';
import type { Modality } from '@/lib/schedule/spec';

// Everything that goes in is parsed with limitProfileSchema, and everything that comes
// out is parsed again (limit-profile-shape.ts), so a row edited by hand can never reach
// the safety sheet unchecked.

export type StoredLimitProfile = {
  id: string;
  labId: string;
  rigId: string | null;
  rigName: string | null;
  updatedAt: Date;
  updatedBy: string | null;
  updatedByEmail: string | null;
  profile: LimitProfile;
};

/** Who made a change and from where (the client address, for the audit log). */
export type Actor = { userId: string; label: string; ip?: string | null };

type Row = typeof limitProfiles.$inferSelect & { rigName: string | null; updatedByEmail: string | null };

const columns = {
  id: limitProfiles.id,
  labId: limitProfiles.labId,
  rigId: limitProfiles.rigId,
  modality: limitProfiles.modality,
  name: limitProfiles.name,
  limits: limitProfiles.limits,
  updatedBy: limitProfiles.updatedBy,
  updatedAt: limitProfiles.updatedAt,
  rigName: rigs.name,
  updatedByEmail: users.email,
};

function fromRow(row: Row): StoredLimitProfile {
  const parsed = fromLimitColumns(row);
  if (!parsed.success) {
    const where = zodIssues(parsed.error).map((i) => `${i.path}: ${i.message}`).join('; ');
    throw new Error(`Limit profile ${row.id} is stored in a form Pulseloom cannot read (${where}).`);
  }
  return {
    id: row.id,
    labId: row.labId,
    rigId: row.rigId,
    rigName: row.rigName,
    updatedAt: row.updatedAt,
    updatedBy: row.updatedBy,
    updatedByEmail: row.updatedByEmail,
    profile: parsed.data,
  };
}

/** Parses untrusted input with the shared schema: bad input is a 400 with field paths. */
export function parseLimitProfile(input: unknown): LimitProfile {
  const parsed = limitProfileSchema.safeParse(input);
  if (!parsed.success) throw badRequest('Some limits are not valid.', zodIssues(parsed.error));
  return parsed.data;
}

export async function listLimitProfiles({ labId }: { labId: string }): Promise<StoredLimitProfile[]> {
  const rows = await db
    .select(columns)
    .from(limitProfiles)
    .leftJoin(rigs, eq(rigs.id, limitProfiles.rigId))
    .leftJoin(users, eq(users.id, limitProfiles.updatedBy))
    .where(eq(limitProfiles.labId, labId))
    .orderBy(asc(limitProfiles.modality), sql`${limitProfiles.rigId} nulls first`, asc(limitProfiles.name));
  return rows.map(fromRow);
}

export async function getLimitProfile({ labId, id }: { labId: string; id: string }): Promise<StoredLimitProfile | null> {
  const [row] = await db
    .select(columns)
    .from(limitProfiles)
    .leftJoin(rigs, eq(rigs.id, limitProfiles.rigId))
    .leftJoin(users, eq(users.id, limitProfiles.updatedBy))
    .where(and(eq(limitProfiles.labId, labId), eq(limitProfiles.id, id)))
    .limit(1);
  return row ? fromRow(row) : null;
}

/**
 * The limits that apply to a version: the rig's own profile when it has one, else the
 * lab's profile for the modality, else null (the caller decides what a lab without
 * limits sees).
 */
export async function profileFor({
  labId,
  modality,
  rigId,
}: {
  labId: string;
  modality: Modality;
  rigId?: string | null;
}): Promise<StoredLimitProfile | null> {
  const rows = await db
    .select(columns)
    .from(limitProfiles)
    .leftJoin(rigs, eq(rigs.id, limitProfiles.rigId))
    .leftJoin(users, eq(users.id, limitProfiles.updatedBy))
    .where(and(eq(limitProfiles.labId, labId), eq(limitProfiles.modality, modality)))
    .orderBy(asc(limitProfiles.updatedAt));
  const forRig = rigId ? rows.find((r) => r.rigId === rigId) : undefined;
  const forLab = rows.find((r) => r.rigId === null);
  const chosen = forRig ?? forLab;
  return chosen ? fromRow(chosen) : null;
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Checks that run inside the write transaction, after the lab row is locked so two
 * saves cannot both claim the same scope: the rig belongs to the lab and has the
 * profile's modality, and no other profile already covers that rig (or the whole lab).
 */
async function checkScope(tx: Tx, labId: string, profile: LimitProfile, exceptId?: string) {
  await tx.select({ id: labs.id }).from(labs).where(eq(labs.id, labId)).for('update');
  const rigId = profile.rigId ?? null;
  if (rigId) {
    const [rig] = await tx
      .select({ modality: rigs.modality, name: rigs.name })
      .from(rigs)
      .where(and(eq(rigs.labId, labId), eq(rigs.id, rigId)))
      .limit(1);
    if (!rig) throw badRequest('That rig is not in this lab.', [{ path: 'rigId', message: 'not a rig of this lab' }]);
    if (rig.modality !== profile.modality) {
      throw badRequest(`${rig.name} is ${rig.modality}; this profile is ${profile.modality}.`, [
        { path: 'rigId', message: `the rig is ${rig.modality}, the profile ${profile.modality}` },
      ]);
    }
  }
  const same = await tx
    .select({ id: limitProfiles.id, name: limitProfiles.name })
    .from(limitProfiles)
    .where(
      and(
        eq(limitProfiles.labId, labId),
        eq(limitProfiles.modality, profile.modality),
        rigId ? eq(limitProfiles.rigId, rigId) : isNull(limitProfiles.rigId),
        exceptId ? ne(limitProfiles.id, exceptId) : undefined,
      ),
    )
    .limit(1);
  if (same[0]) {
    throw conflict(
      rigId
        ? `“${same[0].name}” already holds this rig’s ${profile.modality} limits; edit that profile instead.`
        : `“${same[0].name}” already holds the lab’s ${profile.modality} limits; edit that profile instead.`,
    );
  }
}

export async function createLimitProfile({
  labId,
  input,
  actor,
}: {
  labId: string;
  input: unknown;
  actor: Actor;
}): Promise<StoredLimitProfile> {
  const profile = parseLimitProfile(input);
  const id = await db.transaction(async (tx) => {
    await checkScope(tx, labId, profile);
    const [row] = await tx
      .insert(limitProfiles)
      .values({ ...toLimitColumns(profile), labId, updatedBy: actor.userId })
      .returning({ id: limitProfiles.id });
    await recordAudit(tx, {
      labId,
      actor: { userId: actor.userId, label: actor.label },
      ip: actor.ip ?? null,
      action: 'limits.created',
      subjectType: 'limit_profile',
      subjectId: row!.id,
      details: { profile },
    });
    return row!.id;
  });
  return (await getLimitProfile({ labId, id }))!;
}

/**
 * Replaces a profile's name, scope and limits. `expectedUpdatedAt` is the time the
 * editor loaded it: a save over someone else's newer save is refused, not merged.
 */
export async function updateLimitProfile({
  labId,
  id,
  input,
  actor,
  expectedUpdatedAt,
}: {
  labId: string;
  id: string;
  input: unknown;
  actor: Actor;
  expectedUpdatedAt?: Date;
}): Promise<StoredLimitProfile> {
  const profile = parseLimitProfile(input);
  await db.transaction(async (tx) => {
    const [before] = await tx
      .select(columns)
      .from(limitProfiles)
      .leftJoin(rigs, eq(rigs.id, limitProfiles.rigId))
    .leftJoin(users, eq(users.id, limitProfiles.updatedBy))
      .where(and(eq(limitProfiles.labId, labId), eq(limitProfiles.id, id)))
      .for('update', { of: limitProfiles });
    if (!before) throw notFound('That limit profile does not exist in this lab.');
    if (expectedUpdatedAt && before.updatedAt.getTime() !== expectedUpdatedAt.getTime()) {
      throw conflict('Someone saved this profile after you opened it. Reload to see their limits, then edit again.');
    }
    const previous = fromRow(before).profile;
    const normalized = { ...profile, rigId: profile.rigId ?? null };
    if (before.modality !== profile.modality) {
      throw badRequest('A profile keeps its modality; create a new profile instead.', [
        { path: 'modality', message: `this profile is ${before.modality}` },
      ]);
    }
    await checkScope(tx, labId, profile, id);
    await tx
      .update(limitProfiles)
      .set({ ...toLimitColumns(profile), updatedBy: actor.userId, updatedAt: new Date() })
      .where(and(eq(limitProfiles.labId, labId), eq(limitProfiles.id, id)));
    await recordAudit(tx, {
      labId,
      actor: { userId: actor.userId, label: actor.label },
      ip: actor.ip ?? null,
      action: 'limits.updated',
      subjectType: 'limit_profile',
      subjectId: id,
      details: { changes: describeChanges(previous, normalized), before: previous, after: normalized },
    });
  });
  return (await getLimitProfile({ labId, id }))!;
}

export async function deleteLimitProfile({ labId, id, actor }: { labId: string; id: string; actor: Actor }): Promise<void> {
  await db.transaction(async (tx) => {
    const [gone] = await tx
      .delete(limitProfiles)
      .where(and(eq(limitProfiles.labId, labId), eq(limitProfiles.id, id)))
      .returning();
    if (!gone) throw notFound('That limit profile does not exist in this lab.');
    await recordAudit(tx, {
      labId,
      actor: { userId: actor.userId, label: actor.label },
      ip: actor.ip ?? null,
      action: 'limits.deleted',
      subjectType: 'limit_profile',
      subjectId: id,
      details: { name: gone.name, modality: gone.modality, rigId: gone.rigId, limits: gone.limits },
    });
  });
}
