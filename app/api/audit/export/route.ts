import { headers } from 'next/headers';
import { iterateAuditEntries, latestAuditId, recordAudit } from '@/db/queries/audit';
import { db } from '@/db/client';
import { AUDIT_CSV_HEADER, auditCsvLine } from '@/lib/audit/csv';
import { auditFilterSchema, dateRange, searchParamsObject } from '@/lib/audit/filters';
import { clientAddress } from '@/lib/auth/rate-limit';
import { badRequest, zodIssues } from '@/lib/http/errors';
import { requireRouteMember, route } from '@/lib/http/route';

/** The audit page's filtered rows as CSV, every page of them, streamed in batches. */
export const GET = route(async (req: Request) => {
  const member = await requireRouteMember('audit.view');
  const parsed = auditFilterSchema.safeParse(searchParamsObject(new URL(req.url).searchParams));
  if (!parsed.success) throw badRequest('Some filters are not valid.', zodIssues(parsed.error));
  const f = parsed.data;
  const query = { labId: member.lab.id, action: f.action, actor: f.actor, subjectType: f.subjectType, ...dateRange(f) };

  // The file is a snapshot: entries appended while it streams are left out. Downloading
  // the log is itself an export of lab records, so it is logged, after the snapshot
  // point, so the file matches what the page showed.
  const lastId = await latestAuditId({ labId: member.lab.id });
  await recordAudit(db, {
    labId: member.lab.id,
    actor: { userId: member.user.id, label: member.user.email },
    action: 'audit.exported',
    subjectType: 'audit_log',
    ip: clientAddress(await headers()),
    details: { filters: { action: f.action, actor: f.actor, subjectType: f.subjectType, from: f.from, to: f.to } },
  });

  const encoder = new TextEncoder();
  const batches = iterateAuditEntries(query, { upToId: lastId });
  const stream = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(encoder.encode(AUDIT_CSV_HEADER));
    },
    async pull(controller) {
      try {
        const next = await batches.next();
        if (next.done) return controller.close();
        controller.enqueue(encoder.encode(next.value.map(auditCsvLine).join('')));
      } catch (err) {
        // Headers are already sent: fail the download rather than end it short and look complete.
        console.error('[pulseloom] audit export failed', err);
        controller.error(err);
      }
    },
    async cancel() {
      await batches.return(undefined);
    },
  });

  const day = new Date().toISOString().slice(0, 10);
  return new Response(stream, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="pulseloom-audit-${member.lab.slug}-${day}.csv"`,
      'Cache-Control': 'no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
});
