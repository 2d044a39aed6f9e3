import { buildPreview, parsePreviewRequest } from '@/lib/preview';
import { readJson, requireRouteMember, route } from '@/lib/http/route';
import { z } from 'zod';

export const dynamic = 'force-dynamic';

/**
 * POST { spec, trials? } → a few seeded trials of the schedule plus the statistics the
 * editor plots. Spec problems answer 400 with each JSON path and its reason.
 */
export const POST = route(async (request: Request) => {
  await requireRouteMember('envelopes.view');
  const body = await readJson(request, z.unknown(), 12_000_000);
  const parsed = parsePreviewRequest(body);
  if (!parsed.ok) {
    return Response.json(
      { error: { code: 'invalid_spec', message: 'The spec is not valid.', issues: parsed.errors }, errors: parsed.errors },
      { status: 400 },
    );
  }
  return Response.json(buildPreview(parsed.spec, { trials: parsed.trials }), { headers: { 'cache-control': 'no-store' } });
});
