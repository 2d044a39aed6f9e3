import { and, asc, eq, inArray } from 'drizzle-orm';
import { db } from '../client';
import { exportAcknowledgements, protocolVersions, protocols, users } from '../schema';

/** A version of the lab with what an export needs; null when it is not the lab's. */
export async function getVersionForExport({ labId, versionId }: { labId: string; versionId: string }) {
  const [row] = await db
    .select({
      id: protocolVersions.id,
      number: protocolVersions.number,
      status: protocolVersions.status,
      spec: protocolVersions.spec,
      checksum: protocolVersions.checksum,
      approvedChecksum: protocolVersions.approvedChecksum,
      pulseCount: protocolVersions.pulseCount,
      decidedAt: protocolVersions.decidedAt,
      rigId: protocolVersions.rigId,
      protocol: protocols.name,
      modality: protocols.modality,
      approverName: users.name,
      approverEmail: users.email,
    })
    .from(protocolVersions)
    .innerJoin(protocols, and(eq(protocols.id, protocolVersions.protocolId), eq(protocols.labId, protocolVersions.labId)))
    .leftJoin(users, eq(users.id, protocolVersions.decidedBy))
    .where(and(eq(protocolVersions.labId, labId), eq(protocolVersions.id, versionId)))
    .limit(1);
  return row ?? null;
}

export async function getAcknowledgement({ labId, versionId, userId }: { labId: string; versionId: string; userId: string }) {
  const [row] = await db
    .select({ acknowledgedAt: exportAcknowledgements.acknowledgedAt })
    .from(exportAcknowledgements)
    .where(
      and(
        eq(exportAcknowledgements.labId, labId),
        eq(exportAcknowledgements.versionId, versionId),
        eq(exportAcknowledgements.userId, userId),
      ),
    )
    .limit(1);
  return row?.acknowledgedAt ?? null;
}

/** Versions assigned to a rig that are not approved (yet, or any more): preview exports only. */
export async function listUnapprovedForRig({ labId, rigId }: { labId: string; rigId: string }) {
  return db
    .select({
      id: protocolVersions.id,
      protocolId: protocolVersions.protocolId,
      name: protocols.name,
      version: protocolVersions.number,
      status: protocolVersions.status,
      modality: protocols.modality,
      updatedAt: protocolVersions.updatedAt,
    })
    .from(protocolVersions)
    .innerJoin(protocols, and(eq(protocols.id, protocolVersions.protocolId), eq(protocols.labId, protocolVersions.labId)))
    .where(
      and(
        eq(protocolVersions.labId, labId),
        eq(protocolVersions.rigId, rigId),
        inArray(protocolVersions.status, ['draft', 'in_review', 'returned']),
      ),
    )
    .orderBy(asc(protocols.name), asc(protocolVersions.number));
}
