import { z } from 'zod';
import { clientAddress } from '@/lib/auth/rate-limit';
import { exportVersionFile } from '@/lib/exports/export';
import { badRequest, notFound, zodIssues } from '@/lib/http/errors';
import { requireRouteMember, route } from '@/lib/http/route';

export const dynamic = 'force-dynamic';

const querySchema = z.object({
  format: z.enum(['csv', 'json'], { error: 'format must be "csv" or "json"' }),
});

/**
 * GET /api/versions/<id>/export?format=csv|json — the schedule file of one version for a
 * signed-in experimenter or safety officer who has acknowledged the cautions (else 409).
 */
export const GET = route(async (request: Request, ctx: { params: Promise<{ id: string }> }) => {
  const member = await requireRouteMember('exports.download');
  const { id } = await ctx.params;
  if (!z.uuid().safeParse(id).success) throw notFound('No such protocol version in this lab.');
  const query = querySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!query.success) throw badRequest('Say which format to export.', zodIssues(query.error));
  return exportVersionFile(
    { labId: member.lab.id, userId: member.user.id, email: member.user.email, ip: clientAddress(request.headers) },
    request,
    id,
    query.data.format,
  );
});
