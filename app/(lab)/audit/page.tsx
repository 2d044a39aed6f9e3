import Link from 'next/link';
import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { auditFilterChoices, listAuditEntries } from '@/db/queries/audit';
import { auditFilterSchema, dateRange, filterQuery, searchParamsObject, type AuditFilter } from '@/lib/audit/filters';
import { requireMember } from '@/lib/auth/guard';
import { formatPath } from '@/lib/http/errors';

const PAGE_SIZE = 50;

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function AuditPage({ searchParams }: Props) {
  const member = await requireMember('audit.view');
  const raw = searchParamsObject(await searchParams);
  const parsed = auditFilterSchema.safeParse(raw);
  const choices = await auditFilterChoices({ labId: member.lab.id });

  const header = (
    <PageHeader
      title="Audit log"
      lead="Every state change, approval, export and rig download in this lab: who or which token, what, when, from where, and the schedule checksum. Entries are never changed or removed."
    />
  );

  if (!parsed.success) {
    return (
      <>
        {header}
        <Filters values={raw} choices={choices} />
        <div role="alert" className="mt-4 rounded-card border border-danger/60 bg-danger-soft px-4 py-3 text-sm">
          <p className="font-medium">These filters cannot be used:</p>
          <ul className="mt-1 list-disc pl-5">
            {parsed.error.issues.map((i) => (
              <li key={`${formatPath(i.path)}-${i.message}`}>
                <span className="font-mono">{formatPath(i.path)}</span>: {i.message}
              </li>
            ))}
          </ul>
        </div>
      </>
    );
  }

  const f = parsed.data;
  const { rows, total } = await listAuditEntries({
    labId: member.lab.id,
    action: f.action,
    actor: f.actor,
    subjectType: f.subjectType,
    ...dateRange(f),
    limit: PAGE_SIZE,
    offset: (f.page - 1) * PAGE_SIZE,
  });
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));
  const filtered = Boolean(f.action || f.actor || f.subjectType || f.from || f.to);

  return (
    <>
      {header}
      <Filters values={raw} choices={choices} />
      <div className="mt-4 flex flex-wrap items-center justify-between gap-3 text-sm">
        <p className="text-ink-muted" data-testid="audit-count" aria-live="polite">
          {total === 1 ? '1 entry' : `${total.toLocaleString('en')} entries`}
          {filtered ? (total === 1 ? ' matches these filters' : ' match these filters') : ''}
          {total > PAGE_SIZE ? ` · page ${f.page} of ${pages}` : ''}
        </p>
        {total > 0 ? (
          <a href={`/api/audit/export${filterQuery(f)}`} className="btn" download data-testid="audit-csv">
            Download CSV ({total.toLocaleString('en')} {total === 1 ? 'row' : 'rows'})
          </a>
        ) : null}
      </div>

      {rows.length === 0 ? (
        <div className="mt-4">
          <EmptyState title={filtered ? 'Nothing matches these filters' : 'No audit entries yet'}>
            {filtered
              ? 'Widen the date range or clear a filter.'
              : 'State changes, approvals, exports and rig downloads are recorded here as they happen.'}
          </EmptyState>
        </div>
      ) : (
        <div className="card mt-4 overflow-x-auto p-0">
          <table className="table" data-testid="audit-table">
            <thead>
              <tr>
                <th scope="col">When (UTC)</th>
                <th scope="col">Who</th>
                <th scope="col">What</th>
                <th scope="col">Subject</th>
                <th scope="col">From</th>
                <th scope="col">Checksum</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.id} className="align-top" data-audit-id={r.id}>
                  <td className="whitespace-nowrap font-mono text-xs">
                    <time dateTime={r.at.toISOString()}>{r.at.toISOString().slice(0, 19).replace('T', ' ')}</time>
                  </td>
                  <td>
                    {r.actorLabel}
                    {r.actorTokenId ? <div className="text-xs text-ink-muted">rig token</div> : null}
                  </td>
                  <td>
                    <span className="font-mono text-xs">{r.action}</span>
                    {hasDetails(r.details) ? (
                      <details className="mt-1 text-xs text-ink-muted">
                        <summary className="cursor-pointer select-none hover:text-ink">Details</summary>
                        <pre className="mt-1 max-w-md overflow-x-auto whitespace-pre-wrap break-all font-mono">
                          {JSON.stringify(r.details, null, 2)}
                        </pre>
                      </details>
                    ) : null}
                  </td>
                  <td className="text-xs">
                    {r.subjectType}
                    {r.subjectId ? <div className="font-mono text-ink-muted">{r.subjectId}</div> : null}
                  </td>
                  <td className="font-mono text-xs text-ink-muted">{r.ip ?? '—'}</td>
                  <td className="max-w-48 break-all font-mono text-xs text-ink-muted">{r.checksum ?? '—'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}

      {pages > 1 ? <Pager filter={f} page={f.page} pages={pages} /> : null}
    </>
  );
}

function hasDetails(d: unknown): boolean {
  return typeof d === 'object' && d !== null && Object.keys(d).length > 0;
}

function Filters({
  values,
  choices,
}: {
  values: Record<string, string>;
  choices: { actions: string[]; actors: string[]; subjectTypes: string[] };
}) {
  // A plain GET form: filters live in the address, so a filtered view can be bookmarked
  // or shared, and it works without JavaScript.
  return (
    <form method="get" action="/audit" className="card grid gap-3 sm:grid-cols-2 lg:grid-cols-6" aria-label="Filter the audit log">
      <div className="lg:col-span-1">
        <label htmlFor="af-action" className="label">Action</label>
        <select id="af-action" name="action" defaultValue={values.action ?? ''} className="field">
          <option value="">Any</option>
          {choices.actions.map((a) => (
            <option key={a} value={a}>{a}</option>
          ))}
        </select>
      </div>
      <div className="lg:col-span-1">
        <label htmlFor="af-actor" className="label">Actor</label>
        <input id="af-actor" name="actor" defaultValue={values.actor ?? ''} className="field" list="af-actors" placeholder="e-mail or token" />
        <datalist id="af-actors">
          {choices.actors.map((a) => (
            <option key={a} value={a} />
          ))}
        </datalist>
      </div>
      <div className="lg:col-span-1">
        <label htmlFor="af-subject" className="label">Subject type</label>
        <select id="af-subject" name="subjectType" defaultValue={values.subjectType ?? ''} className="field">
          <option value="">Any</option>
          {choices.subjectTypes.map((s) => (
            <option key={s} value={s}>{s}</option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="af-from" className="label">From (UTC)</label>
        <input id="af-from" name="from" type="date" defaultValue={values.from ?? ''} className="field" />
      </div>
      <div>
        <label htmlFor="af-to" className="label">To (UTC, included)</label>
        <input id="af-to" name="to" type="date" defaultValue={values.to ?? ''} className="field" />
      </div>
      <div className="flex items-end gap-2">
        <button type="submit" className="btn btn-primary">Apply</button>
        <Link href="/audit" className="btn">Clear</Link>
      </div>
    </form>
  );
}

function Pager({ filter, page, pages }: { filter: AuditFilter; page: number; pages: number }) {
  return (
    <nav aria-label="Audit pages" className="mt-4 flex items-center justify-between text-sm">
      {page > 1 ? (
        <Link href={`/audit${filterQuery(filter, page - 1)}`} className="btn" rel="prev">Newer</Link>
      ) : (
        <span />
      )}
      <span className="text-ink-muted">Page {page} of {pages}</span>
      {page < pages ? (
        <Link href={`/audit${filterQuery(filter, page + 1)}`} className="btn" rel="next">Older</Link>
      ) : (
        <span />
      )}
    </nav>
  );
}
