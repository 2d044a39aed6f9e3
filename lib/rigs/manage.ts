/**
 * Changes to rigs and their tokens. Each runs in one transaction with its audit row;
 * the thin server actions in app/(lab)/rigs call these after the session and role checks.
 */
import { and, eq, isNull, sql } from 'drizzle-orm';
import { db } from '@/db/client';
import { rigTokens, rigs } from '@/db/schema';
import { recordAudit } from '@/db/queries/audit';
import { countVersionsOnRig, findRigByName, getRig, type RigRow } from '@/db/queries/rigs';
import { hashSecret, newSecret } from '@/lib/auth/tokens';
import { AppError, conflict, notFound } from '@/lib/http/errors';
import { forgetTokens } from '@/lib/rig-api/token-cache';
import { TOKEN_PREFIX, type RigValues } from './schema';

export type Actor = { labId: string; userId: string; email: string; ip?: string | null };

const actorOf = (a: Actor) => ({ userId: a.userId, label: a.email });

/** Column values for one modality; the other modality's columns are cleared. */
function columns(v: RigValues) {
  const optical = v.modality === 'optical';
  return {
    name: v.name,
    modality: v.modality,
    clockHz: v.clockHz,
    channels: v.channels,
    notes: v.notes,
    wavelengthNm: optical ? v.wavelengthNm : null,
    fibreCoreUm: optical ? v.fibreCoreUm : null,
    fibreNA: optical ? v.fibreNA : null,
    electrodeMaterial: optical ? null : v.electrodeMaterial,
    electrodeAreaMm2: optical ? null : v.electrodeAreaMm2,
  };
}

const nameTaken = (name: string) =>
  new AppError(409, 'conflict', 'Another rig of this lab has that name.', [{ path: 'name', message: `“${name}” is taken by another rig` }]);

export async function createRig(actor: Actor, values: RigValues): Promise<RigRow> {
  if (await findRigByName({ labId: actor.labId, name: values.name })) throw nameTaken(values.name);
  return db.transaction(async (tx) => {
    const [rig] = await tx.insert(rigs).values({ labId: actor.labId, ...columns(values) }).returning();
    await recordAudit(tx, {
      labId: actor.labId,
      actor: actorOf(actor),
      action: 'rig.created',
      subjectType: 'rig',
      subjectId: rig!.id,
      ip: actor.ip,
      details: { ...columns(values) },
    });
    return rig!;
  });
}

/**
 * Versions under review or approved were generated on the rig's clock and for its
 * modality: changing either under them would make the rig play something nobody approved.
 */
export async function updateRig(actor: Actor, rigId: string, values: RigValues): Promise<RigRow> {
  const before = await getRig({ labId: actor.labId, rigId });
  if (!before) throw notFound('No such rig in this lab.');
  if (await findRigByName({ labId: actor.labId, name: values.name, exceptId: rigId })) throw nameTaken(values.name);
  const versions = await countVersionsOnRig({ labId: actor.labId, rigId });
  if (values.modality !== before.modality && versions.total > 0) {
    throw new AppError(409, 'conflict', 'Protocol versions already use this rig.', [
      { path: 'modality', message: `${versions.total} protocol version(s) are made for this ${before.modality} rig; register a new rig instead` },
    ]);
  }
  if (values.clockHz !== before.clockHz && versions.frozen > 0) {
    throw new AppError(409, 'conflict', 'Submitted or approved schedules are placed on the current clock.', [
      {
        path: 'clockHz',
        message: `${versions.frozen} submitted or approved version(s) are placed on ${before.clockHz} Hz; withdraw them or register a new rig`,
      },
    ]);
  }
  const next = columns(values);
  const changed: Record<string, { from: unknown; to: unknown }> = {};
  for (const [k, v] of Object.entries(next)) {
    const old = (before as Record<string, unknown>)[k];
    if ((old ?? null) !== (v ?? null)) changed[k] = { from: old ?? null, to: v ?? null };
  }
  if (Object.keys(changed).length === 0) return before;
  return db.transaction(async (tx) => {
    const [rig] = await tx
      .update(rigs)
      .set(next)
      .where(and(eq(rigs.labId, actor.labId), eq(rigs.id, rigId)))
      .returning();
    if (!rig) throw notFound('No such rig in this lab.');
    await recordAudit(tx, {
      labId: actor.labId,
      actor: actorOf(actor),
      action: 'rig.updated',
      subjectType: 'rig',
      subjectId: rigId,
      ip: actor.ip,
      details: { changed },
    });
    return rig;
  });
}

/** Archived rigs leave the lists and their tokens stop working; nothing is deleted. */
export async function setRigArchived(actor: Actor, rigId: string, archived: boolean): Promise<void> {
  // Dropped before the change too: a request checked in between must not re-remember the
  // token with the rig still live in its row.
  forgetTokens({ rigId });
  await db.transaction(async (tx) => {
    const [rig] = await tx
      .select({ id: rigs.id, name: rigs.name, archivedAt: rigs.archivedAt })
      .from(rigs)
      .where(and(eq(rigs.labId, actor.labId), eq(rigs.id, rigId)))
      .for('update');
    if (!rig) throw notFound('No such rig in this lab.');
    if (Boolean(rig.archivedAt) === archived) return;
    if (!archived) {
      const [clash] = await tx
        .select({ id: rigs.id })
        .from(rigs)
        .where(and(eq(rigs.labId, actor.labId), isNull(rigs.archivedAt), sql`lower(${rigs.name}) = lower(${rig.name})`))
        .limit(1);
      if (clash) throw conflict(`A live rig is already called “${rig.name}”; rename it first.`);
    }
    await tx
      .update(rigs)
      .set({ archivedAt: archived ? new Date() : null })
      .where(eq(rigs.id, rigId));
    await recordAudit(tx, {
      labId: actor.labId,
      actor: actorOf(actor),
      action: archived ? 'rig.archived' : 'rig.restored',
      subjectType: 'rig',
      subjectId: rigId,
      ip: actor.ip,
      details: { name: rig.name },
    });
  });
  forgetTokens({ rigId });
}

export type CreatedToken = { id: string; name: string; secret: string; expiresAt: Date };

/** The secret is returned once, here; only its SHA-256 is stored. */
export async function createRigToken(
  actor: Actor,
  input: { rigId: string; name: string; expiresInDays: number },
): Promise<CreatedToken> {
  const rig = await getRig({ labId: actor.labId, rigId: input.rigId });
  if (!rig) throw notFound('No such rig in this lab.');
  if (rig.archivedAt) throw conflict('This rig is archived; restore it before giving it a token.');
  const secret = newSecret(TOKEN_PREFIX);
  const expiresAt = new Date(Date.now() + input.expiresInDays * 86_400_000);
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(rigTokens)
      .values({ labId: actor.labId, rigId: rig.id, name: input.name, tokenHash: hashSecret(secret), createdBy: actor.userId, expiresAt })
      .returning({ id: rigTokens.id });
    await recordAudit(tx, {
      labId: actor.labId,
      actor: actorOf(actor),
      action: 'rig_token.created',
      subjectType: 'rig_token',
      subjectId: row!.id,
      ip: actor.ip,
      details: { name: input.name, rigId: rig.id, rig: rig.name, expiresAt: expiresAt.toISOString() },
    });
    return { id: row!.id, name: input.name, secret, expiresAt };
  });
}

export async function revokeRigToken(actor: Actor, input: { rigId: string; tokenId: string }): Promise<void> {
  forgetTokens({ tokenId: input.tokenId });
  await db.transaction(async (tx) => {
    const [token] = await tx
      .update(rigTokens)
      .set({ revokedAt: new Date() })
      .where(
        and(
          eq(rigTokens.labId, actor.labId),
          eq(rigTokens.rigId, input.rigId),
          eq(rigTokens.id, input.tokenId),
          isNull(rigTokens.revokedAt),
        ),
      )
      .returning({ id: rigTokens.id, name: rigTokens.name });
    if (!token) {
      const [exists] = await tx
        .select({ id: rigTokens.id })
        .from(rigTokens)
        .where(and(eq(rigTokens.labId, actor.labId), eq(rigTokens.rigId, input.rigId), eq(rigTokens.id, input.tokenId)))
        .limit(1);
      if (!exists) throw notFound('No such token on this rig.');
      return; // already revoked: nothing changes, nothing to record
    }
    await recordAudit(tx, {
      labId: actor.labId,
      actor: actorOf(actor),
      action: 'rig_token.revoked',
      subjectType: 'rig_token',
      subjectId: token.id,
      ip: actor.ip,
      details: { name: token.name, rigId: input.rigId },
    });
  });
  forgetTokens({ tokenId: input.tokenId });
}
