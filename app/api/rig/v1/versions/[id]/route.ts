import { getApprovedForRig, getVersionSpec, recordRigDownload } from '@/db/queries/rig-api';
import { notFound } from '@/lib/http/errors';
import { authenticateRig } from '@/lib/rig-api/auth';
import { parseVersionRef, negotiate } from '@/lib/rig-api/format';
import { notAcceptable, rigRoute } from '@/lib/rig-api/handler';
import { planApprovedFile } from '@/lib/rig-api/respond';

export const dynamic = 'force-dynamic';

// One answer for "no such id", "another rig's", "another lab's" and "not approved":
// a token learns nothing about what it may not read.
const NOT_HERE = 'No approved version with this id is assigned to this rig.';

/**
 * GET /api/rig/v1/versions/<id>[.csv|.json] — one approved schedule file.
 * Format: the extension if given, else the Accept header (CSV when it allows anything).
 */
export const GET = rigRoute(async (request: Request, ctx: { params: Promise<{ id: string }> }) => {
  const auth = await authenticateRig(request);
  const ref = parseVersionRef((await ctx.params).id);
  if (!ref) throw notFound(NOT_HERE);
  const format = ref.ext ?? negotiate(request.headers.get('accept'));
  if (!format) return notAcceptable();

  const version = await getApprovedForRig({ labId: auth.labId, rigId: auth.rig.id, versionId: ref.id });
  if (!version || !version.checksum) throw notFound(NOT_HERE);

  const plan = planApprovedFile(
    request,
    { ...version, checksum: version.checksum },
    format,
    ref.ext ? 'Authorization' : 'Accept, Authorization',
    () => getVersionSpec({ labId: auth.labId, versionId: version.id }),
  );
  if (request.method !== 'HEAD') {
    await recordRigDownload({
      labId: auth.labId,
      actor: { tokenId: auth.token.id, label: `token ${auth.token.name}` },
      action: plan.notModified ? 'rig.version_unchanged' : 'rig.version_downloaded',
      subjectType: 'protocol_version',
      subjectId: version.id,
      checksum: version.checksum,
      ip: auth.address,
      details: { rigId: auth.rig.id, rig: auth.rig.name, format, file: plan.fileName },
    });
  }
  return plan.respond();
});
