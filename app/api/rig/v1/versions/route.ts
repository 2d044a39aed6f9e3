import { listApprovedForRig } from '@/db/queries/rig-api';
import { authenticateRig } from '@/lib/rig-api/auth';
import { rigRoute } from '@/lib/rig-api/handler';

export const dynamic = 'force-dynamic';

/** GET /api/rig/v1/versions — the approved protocol versions assigned to the token's rig. */
export const GET = rigRoute(async (request: Request) => {
  const { rig, labId } = await authenticateRig(request);
  const rows = await listApprovedForRig({ labId, rigId: rig.id });
  const base = '/api/rig/v1/versions';
  return Response.json(
    {
      rig: { id: rig.id, name: rig.name, modality: rig.modality, clockHz: rig.clockHz },
      versions: rows.map((v) => ({
        id: v.id,
        name: v.name,
        version: v.version,
        checksum: v.checksum,
        approvedAt: v.approvedAt?.toISOString() ?? null,
        clockHz: v.clockHz,
        trials: v.trials,
        files: { csv: `${base}/${v.id}.csv`, json: `${base}/${v.id}.json` },
      })),
    },
    { headers: { 'Cache-Control': 'private, no-cache', Vary: 'Authorization' } },
  );
});
