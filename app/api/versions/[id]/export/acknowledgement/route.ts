import { z } from 'zod';
import { getAcknowledgement } from '@/db/queries/exports';
import { notFound } from '@/lib/http/errors';
import { requireRouteMember, route } from '@/lib/http/route';

export const dynamic = 'force-dynamic';

/** GET — whether the signed-in person has acknowledged this version's export cautions. */
export const GET = route(async (_request: Request, ctx: { params: Promise<{ id: string }> }) => {
  const member = await requireRouteMember('exports.download');
  const { id } = await ctx.params;
  if (!z.uuid().safeParse(id).success) throw notFound('No such protocol version in this lab.');
  const at = await getAcknowledgement({ labId: member.lab.id, versionId: id, userId: member.user.id });
  return Response.json({ acknowledgedAt: at?.toISOString() ?? null }, { headers: { 'Cache-Control': 'private, no-store' } });
});
