import Link from 'next/link';
import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { formatWhen } from '@/components/versions/CommentList';
import { StatusBadge } from '@/components/versions/StatusBadge';
import { listReviewQueue, queueFilterOptions } from '@/db/queries/versions';
import { requireMember } from '@/lib/auth/guard';
import { QUEUE_PAGE_SIZE, queueQuerySchema, type QueueQuery } from '@/lib/versions/schemas';
import { STATUS_LABELS, VERSION_STATUSES } from '@/lib/versions/status';

const COLUMNS: { key: QueueQuery['sort'] | null; label: string }[] = [
  { key: 'protocol', label: 'Protocol' },
  { key: null, label: 'Version' },
  { key: 'status', label: 'State' },
  { key: 'rig', label: 'Rig' },
  { key: 'author', label: 'Author' },
  { key: 'submitted', label: 'Submitted' },
];

function href(q: QueueQuery, over: Partial<QueueQuery>) {
  const next = { ...q, ...over };
  const p = new URLSearchParams();
  if (next.status !== 'in_review') p.set('status', next.status);
  if (next.rig) p.set('rig', next.rig);
  if (next.author) p.set('author', next.author);
  if (next.sort !== 'submitted') p.set('sort', next.sort);
  if (next.dir !== 'asc') p.set('dir', next.dir);
  if (next.page > 1) p.set('page', String(next.page));
  const s = p.toString();
  return s ? `/reviews?${s}` : '/reviews';
}

export default async function ReviewQueuePage({ searchParams }: PageProps<'/reviews'>) {
  const member = await requireMember('reviews.view');
  const raw = await searchParams;
  const one = (k: string) => (typeof raw[k] === 'string' ? raw[k] : undefined);
  const query = queueQuerySchema.parse({ status: one('status'), rig: one('rig'), author: one('author'), sort: one('sort'), dir: one('dir'), page: one('page') });
  const [{ rows, total }, options] = await Promise.all([
    listReviewQueue({ labId: member.lab.id, query }),
    queueFilterOptions({ labId: member.lab.id }),
  ]);
  const pages = Math.max(1, Math.ceil(total / QUEUE_PAGE_SIZE));
  const filtered = query.status !== 'in_review' || query.rig || query.author;

  return (
    <>
      <PageHeader title="Reviews" lead="Versions experimenters submitted, with their safety sheets. Approve one only when you would let it run on the animal as it stands." />
      <form className="mb-4 flex flex-wrap items-end gap-3" aria-label="Filter the queue">
        <div>
          <label htmlFor="q-status" className="label">State</label>
          <select id="q-status" name="status" defaultValue={query.status} className="field">
            {VERSION_STATUSES.filter((s) => s !== 'draft').map((s) => <option key={s} value={s}>{STATUS_LABELS[s]}</option>)}
            <option value="all">Any state</option>
          </select>
        </div>
        <div>
          <label htmlFor="q-rig" className="label">Rig</label>
          <select id="q-rig" name="rig" defaultValue={query.rig ?? ''} className="field">
            <option value="">Any rig</option>
            {options.rigs.map((r) => <option key={r.id} value={r.id}>{r.name}</option>)}
          </select>
        </div>
        <div>
          <label htmlFor="q-author" className="label">Author</label>
          <select id="q-author" name="author" defaultValue={query.author ?? ''} className="field">
            <option value="">Anyone</option>
            {options.authors.map((a) => <option key={a.id} value={a.id}>{a.name ?? a.email}</option>)}
          </select>
        </div>
        <input type="hidden" name="sort" value={query.sort} />
        <input type="hidden" name="dir" value={query.dir} />
        <button type="submit" className="btn">Filter</button>
        {filtered ? <Link href="/reviews" className="btn">Reset</Link> : null}
      </form>

      {rows.length === 0 ? (
        <EmptyState title={query.status === 'in_review' && !filtered ? 'Nothing is waiting for review' : 'No versions match these filters'}>
          {query.status === 'in_review' && !filtered
            ? 'When an experimenter submits a version, it appears here and you get an e-mail.'
            : 'Try another state, rig or author.'}
        </EmptyState>
      ) : (
        <>
          <div className="card overflow-x-auto p-0">
            <table className="table" data-testid="review-queue">
              <caption className="sr-only">
                {total} version{total === 1 ? '' : 's'}, sorted by {query.sort} {query.dir === 'asc' ? 'ascending' : 'descending'}
              </caption>
              <thead>
                <tr>
                  {COLUMNS.map((c) => (
                    <th key={c.label} scope="col" aria-sort={c.key && query.sort === c.key ? (query.dir === 'asc' ? 'ascending' : 'descending') : undefined}>
                      {c.key ? (
                        <Link href={href(query, { sort: c.key, dir: query.sort === c.key && query.dir === 'asc' ? 'desc' : 'asc', page: 1 })} className="hover:text-ink">
                          {c.label}
                          {query.sort === c.key ? (query.dir === 'asc' ? ' ↑' : ' ↓') : ''}
                        </Link>
                      ) : (
                        c.label
                      )}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.id}>
                    <td>
                      <Link href={`/reviews/${r.id}`} className="font-medium text-accent hover:underline">{r.protocolName}</Link>
                      <span className="ml-2 text-xs capitalize text-ink-muted">{r.modality}</span>
                    </td>
                    <td className="font-mono">v{r.number}</td>
                    <td>
                      <StatusBadge status={r.status} />
                      {r.justified ? <span className="ml-2 text-xs text-warn" title="Submitted with a justification for warning-level values">justified</span> : null}
                    </td>
                    <td>{r.rigName ?? '—'}</td>
                    <td>{r.authorName ?? r.authorEmail ?? '—'}</td>
                    <td className="text-xs">{formatWhen(r.submittedAt)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <nav aria-label="Pages" className="mt-3 flex items-center gap-3 text-sm">
            {query.page > 1 ? <Link className="btn" href={href(query, { page: query.page - 1 })} rel="prev">Previous</Link> : <span className="btn opacity-50" aria-disabled="true">Previous</span>}
            <span className="text-ink-muted">Page {Math.min(query.page, pages)} of {pages} · {total} in all</span>
            {query.page < pages ? <Link className="btn" href={href(query, { page: query.page + 1 })} rel="next">Next</Link> : <span className="btn opacity-50" aria-disabled="true">Next</span>}
          </nav>
        </>
      )}
    </>
  );
}
