import 'server-only';
import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { db, type Db } from '../client';
import { envelopes, protocolRigs, protocolVersions, protocols, rigs } from '../schema';

/** The shared client or a transaction handle. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type Conn = Db | Tx;

/** Protocols of a lab with their rigs and their latest version, newest activity first. */
export async function listProtocols({ labId }: { labId: string }) {
  const latest = db
    .selectDistinctOn([protocolVersions.protocolId], {
      protocolId: protocolVersions.protocolId,
      number: protocolVersions.number,
      status: protocolVersions.status,
      updatedAt: protocolVersions.updatedAt,
    })
    .from(protocolVersions)
    .where(eq(protocolVersions.labId, labId))
    .orderBy(protocolVersions.protocolId, desc(protocolVersions.number))
    .as('latest');
  return db
    .select({
      id: protocols.id,
      name: protocols.name,
      modality: protocols.modality,
      target: protocols.target,
      updatedAt: sql<Date>`greatest(${protocols.updatedAt}, coalesce(${latest.updatedAt}, ${protocols.updatedAt}))`.mapWith(
        (v: string | Date) => new Date(v),
      ),
      latestNumber: latest.number,
      latestStatus: latest.status,
      rigNames: sql<string[]>`coalesce((select array_agg(${rigs.name} order by ${rigs.name}) from ${protocolRigs} join ${rigs} on ${rigs.id} = ${protocolRigs.rigId} where ${protocolRigs.protocolId} = ${protocols.id}), '{}')`,
    })
    .from(protocols)
    .leftJoin(latest, eq(latest.protocolId, protocols.id))
    .where(eq(protocols.labId, labId))
    .orderBy(desc(sql`greatest(${protocols.updatedAt}, coalesce(${latest.updatedAt}, ${protocols.updatedAt}))`), asc(protocols.name));
}

export async function getProtocol({ labId, protocolId }: { labId: string; protocolId: string }, conn: Conn = db) {
  const [row] = await conn
    .select()
    .from(protocols)
    .where(and(eq(protocols.labId, labId), eq(protocols.id, protocolId)))
    .limit(1);
  return row ?? null;
}

/** The rigs a protocol may run on (archived ones included, flagged, so history stays readable). */
export async function listProtocolRigs({ labId, protocolId }: { labId: string; protocolId: string }, conn: Conn = db) {
  return conn
    .select({ id: rigs.id, name: rigs.name, modality: rigs.modality, clockHz: rigs.clockHz, archivedAt: rigs.archivedAt })
    .from(protocolRigs)
    .innerJoin(rigs, and(eq(rigs.id, protocolRigs.rigId), eq(rigs.labId, protocolRigs.labId)))
    .where(and(eq(protocolRigs.labId, labId), eq(protocolRigs.protocolId, protocolId)))
    .orderBy(asc(rigs.name));
}

/** Rigs of the lab by id; only live ones, so archived rigs cannot be chosen for new work. */
export async function liveRigsByIds({ labId, rigIds }: { labId: string; rigIds: string[] }, conn: Conn = db) {
  if (rigIds.length === 0) return [];
  return conn
    .select({ id: rigs.id, name: rigs.name, modality: rigs.modality, clockHz: rigs.clockHz })
    .from(rigs)
    .where(and(eq(rigs.labId, labId), inArray(rigs.id, rigIds), isNull(rigs.archivedAt)));
}

/** Envelopes the create form offers as a starting point. */
export async function listStartingEnvelopes({ labId }: { labId: string }) {
  return db
    .select({ id: envelopes.id, name: envelopes.name, modality: envelopes.modality })
    .from(envelopes)
    .where(and(eq(envelopes.labId, labId), isNull(envelopes.deletedAt)))
    .orderBy(asc(envelopes.name));
}

export async function getEnvelopeSpec({ labId, envelopeId }: { labId: string; envelopeId: string }, conn: Conn = db) {
  const [row] = await conn
    .select({ id: envelopes.id, modality: envelopes.modality, spec: envelopes.spec })
    .from(envelopes)
    .where(and(eq(envelopes.labId, labId), eq(envelopes.id, envelopeId), isNull(envelopes.deletedAt)))
    .limit(1);
  return row ?? null;
}

export async function insertProtocol(
  tx: Tx,
  v: { labId: string; name: string; purpose: string; modality: 'optical' | 'electrical'; target: string; createdBy: string; rigIds: string[] },
) {
  const [row] = await tx
    .insert(protocols)
    .values({ labId: v.labId, name: v.name, purpose: v.purpose, modality: v.modality, target: v.target, createdBy: v.createdBy })
    .returning({ id: protocols.id });
  await tx.insert(protocolRigs).values(v.rigIds.map((rigId) => ({ labId: v.labId, protocolId: row!.id, rigId })));
  return row!.id;
}

/** Locks the protocol row: version numbers are handed out one at a time. */
export async function lockProtocol(tx: Tx, { labId, protocolId }: { labId: string; protocolId: string }) {
  const [row] = await tx
    .select({ id: protocols.id })
    .from(protocols)
    .where(and(eq(protocols.labId, labId), eq(protocols.id, protocolId)))
    .for('update');
  return row ?? null;
}

export async function touchProtocol(tx: Tx, { labId, protocolId }: { labId: string; protocolId: string }) {
  await tx.update(protocols).set({ updatedAt: new Date() }).where(and(eq(protocols.labId, labId), eq(protocols.id, protocolId)));
}
