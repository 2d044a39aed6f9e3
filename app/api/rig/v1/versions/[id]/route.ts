import { getVersionSpec, takeApprovedForRig } from '@/db/queries/rig-api';
import { notFound } from '@/lib/http/errors';
import { authenticateRig } from '@/lib/rig-api/auth';
import { negotiate, parseIfNoneMatch, parseVersionRef } from '@/lib/rig-api/format';
import { notAcceptable, rigRoute } from '@/lib/rig-api/handler';
import { planApprovedFile } from '@/lib/rig-api/respond';

export const dynamic = 'force-dynamic';

// One answer for "no such id", "another rig's", "another lab's" and "not approved":
// a token learns nothing about what it may not read.
const NOT_HERE = 'No approved version with this id is assigned to this rig.';

/**
 * GET /api/rig/v1/versions/<id>[.csv|.json] — one approved schedule file.
 * Format: the extension if given, else the Accept header (CSV when it allows anything).
 * Every GET is audited with the token's name (a 304 as `rig.version_unchanged`); HEAD is not.
 */
export const GET = rigRoute(async (request: Request, ctx: { params: Promise<{ id: string }> }) => {
  const auth = await authenticateRig(request);
  const ref = parseVersionRef((await ctx.params).id);
  if (!ref) throw notFound(NOT_HERE);
  const format = ref.ext ?? negotiate(request.headers.get('accept'));
  if (!format) return notAcceptable();

  const version = await takeApprovedForRig({
    labId: auth.labId,
    rigId: auth.rig.id,
    versionId: ref.id,
    record:
      request.method === 'HEAD'
        ? null
        : {
            tokenId: auth.token.id,
            label: `token ${auth.token.name}`,
            ip: auth.address,
            ...parseIfNoneMatch(request.headers.get('if-none-match')),
            details: { rigId: auth.rig.id, rig: auth.rig.name, format },
          },
  });
  if (!version) throw notFound(NOT_HERE);

  const plan = planApprovedFile(
    request,
    version,
    format,
    ref.ext ? 'Authorization' : 'Accept, Authorization',
    () => getVersionSpec({ labId: auth.labId, versionId: version.id }),
  );
  return plan.respond();
});
