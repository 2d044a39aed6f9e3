/**
 * Exports from the app (signed-in people, not rigs). Approved versions give exactly the
 * bytes the rig API serves; every other status gives a preview-marked file. Nothing is
 * exported before the person has acknowledged the cautions for that version.
 */
import { db } from '@/db/client';
import { recordAudit } from '@/db/queries/audit';
import { getAcknowledgement, getVersionForExport } from '@/db/queries/exports';
import { conflict, notFound } from '@/lib/http/errors';
import { scheduleFileName, type ScheduleFormat } from '@/lib/rig-api/format';
import { storedSpec } from '@/lib/rig-api/render';
import { planApprovedFile, previewFileResponse } from '@/lib/rig-api/respond';
import { scanSchedule } from '@/lib/schedule';
import type { ExportActor } from './acknowledge';

export const ACK_REQUIRED =
  'Read and acknowledge the cautions for this version before exporting it (once per version).';

export async function exportVersionFile(actor: ExportActor, request: Request, versionId: string, format: ScheduleFormat): Promise<Response> {
  const v = await getVersionForExport({ labId: actor.labId, versionId });
  if (!v) throw notFound('No such protocol version in this lab.');
  if (!(await getAcknowledgement({ labId: actor.labId, versionId, userId: actor.userId }))) throw conflict(ACK_REQUIRED);

  const audit = (preview: boolean, checksum: string, fileName: string) =>
    recordAudit(db, {
      labId: actor.labId,
      actor: { userId: actor.userId, label: actor.email },
      action: 'version.exported',
      subjectType: 'protocol_version',
      subjectId: v.id,
      checksum,
      ip: actor.ip,
      details: { format, preview, status: v.status, file: fileName },
    });

  if (v.status === 'approved' && v.approvedChecksum) {
    const plan = planApprovedFile(request, { ...v, checksum: v.approvedChecksum }, format, 'Cookie', async () => v.spec);
    await audit(false, v.approvedChecksum, plan.fileName);
    return plan.respond();
  }

  const spec = storedSpec(v.spec);
  // A submitted spec is frozen, so its stored checksum holds; a draft may have changed since.
  const checksum = v.status !== 'draft' && v.checksum ? v.checksum : scanSchedule(spec).checksum;
  const response = previewFileResponse(spec, { id: v.id, number: v.number, status: v.status, protocol: v.protocol, checksum }, format);
  await audit(true, checksum, scheduleFileName({ protocol: v.protocol, version: v.number, checksum, format, preview: true }));
  return response;
}
