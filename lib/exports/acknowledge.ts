/**
 * Acknowledging the export cautions: once per person and version, recorded with the
 * list of cautions that were shown, in one transaction with its audit row.
 */
import { and, eq } from 'drizzle-orm';
import { db } from '@/db/client';
import { exportAcknowledgements, protocolVersions, protocols } from '@/db/schema';
import { recordAudit } from '@/db/queries/audit';
import { notFound } from '@/lib/http/errors';
import { cautionsFor } from '@/lib/safety';

export type ExportActor = { labId: string; userId: string; email: string; ip?: string | null };

export async function acknowledgeCautions(
  actor: ExportActor,
  versionId: string,
): Promise<{ acknowledgedAt: Date; recorded: boolean }> {
  return db.transaction(async (tx) => {
    const [version] = await tx
      .select({ id: protocolVersions.id, status: protocolVersions.status, number: protocolVersions.number, modality: protocols.modality })
      .from(protocolVersions)
      .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
      .where(and(eq(protocolVersions.labId, actor.labId), eq(protocolVersions.id, versionId)))
      .limit(1);
    if (!version) throw notFound('No such protocol version in this lab.');
    const [row] = await tx
      .insert(exportAcknowledgements)
      .values({ labId: actor.labId, versionId, userId: actor.userId })
      .onConflictDoNothing()
      .returning({ acknowledgedAt: exportAcknowledgements.acknowledgedAt });
    if (!row) {
      const [existing] = await tx
        .select({ acknowledgedAt: exportAcknowledgements.acknowledgedAt })
        .from(exportAcknowledgements)
        .where(and(eq(exportAcknowledgements.versionId, versionId), eq(exportAcknowledgements.userId, actor.userId)))
        .limit(1);
      return { acknowledgedAt: existing!.acknowledgedAt, recorded: false };
    }
    await recordAudit(tx, {
      labId: actor.labId,
      actor: { userId: actor.userId, label: actor.email },
      action: 'export.cautions_acknowledged',
      subjectType: 'protocol_version',
      subjectId: versionId,
      ip: actor.ip,
      details: { status: version.status, version: version.number, cautions: cautionsFor(version.modality).map((c) => c.id) },
    });
    return { acknowledgedAt: row.acknowledgedAt, recorded: true };
  });
}
