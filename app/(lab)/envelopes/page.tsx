import Link from 'next/link';
import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { listEnvelopes } from '@/db/queries/envelopes';
import { requireMember } from '@/lib/auth/guard';
import { may } from '@/lib/auth/roles';
import { envelopeListQuerySchema, type EnvelopeListQuery } from '@/lib/envelopes/schema';
import { newEnvelopeAndOpen, undoDeleteAndOpen } from './actions';

const COLUMNS: { key: EnvelopeListQuery['sort']; label: string }[] = [
  { key: 'name', label: 'Name' },
  { key: 'modality', label: 'Modality' },
  { key: 'updated', label: 'Last changed' },
  { key: 'created', label: 'Created' },
];

export default async function EnvelopesPage({ searchParams }: PageProps<'/envelopes'>) {
  const member = await requireMember('envelopes.view');
  const raw = await searchParams;
  const query = envelopeListQuerySchema.parse({ q: raw.q, sort: raw.sort, dir: raw.dir });
  const rows = await listEnvelopes({ labId: member.lab.id, query });
  const canEdit = may(member.roles, 'envelopes.edit');
  const deleted = typeof raw.deleted === 'string' && /^[0-9a-f-]{36}$/.test(raw.deleted) ? raw.deleted : null;

  const sortHref = (key: EnvelopeListQuery['sort']) => {
    const dir = query.sort === key && query.dir === 'asc' ? 'desc' : 'asc';
    const p = new URLSearchParams({ sort: key, dir, ...(query.q ? { q: query.q } : {}) });
    return `/envelopes?${p}`;
  };

  return (
    <>
      <PageHeader
        title="Envelopes"
        lead="Rate envelopes drafted by the lab. Open one to draw, import a measured trace, and preview the schedule it makes."
        actions={
          canEdit ? (
            <>
              <form action={newEnvelopeAndOpen}><input type="hidden" name="modality" value="optical" /><button className="btn btn-primary">New optical envelope</button></form>
              <form action={newEnvelopeAndOpen}><input type="hidden" name="modality" value="electrical" /><button className="btn">New electrical envelope</button></form>
            </>
          ) : null
        }
      />
      {deleted && canEdit ? (
        <form action={undoDeleteAndOpen} role="status" className="mb-4 flex items-center gap-3 rounded-md bg-warn-soft px-4 py-2 text-sm">
          <input type="hidden" name="id" value={deleted} />
          The envelope was deleted.
          <button className="btn py-1">Undo</button>
        </form>
      ) : null}
      <form className="mb-4 flex gap-2" role="search">
        <label htmlFor="envelope-search" className="sr-only">Search envelopes</label>
        <input id="envelope-search" name="q" defaultValue={query.q} placeholder="Search by name or description" className="field max-w-sm" />
        <input type="hidden" name="sort" value={query.sort} />
        <input type="hidden" name="dir" value={query.dir} />
        <button className="btn">Search</button>
      </form>
      {rows.length === 0 ? (
        <EmptyState title={query.q ? `No envelope matches “${query.q}”` : 'No envelopes yet'}>
          {canEdit ? 'Start one with the buttons above, or import a firing-rate trace as CSV from inside the editor.' : 'Experimenters draft envelopes here.'}
        </EmptyState>
      ) : (
        <div className="card overflow-x-auto p-0">
          <table className="table">
            <thead>
              <tr>
                {COLUMNS.map((c) => (
                  <th key={c.key} aria-sort={query.sort === c.key ? (query.dir === 'asc' ? 'ascending' : 'descending') : undefined}>
                    <Link href={sortHref(c.key)} className="hover:text-ink">
                      {c.label}{query.sort === c.key ? (query.dir === 'asc' ? ' ↑' : ' ↓') : ''}
                    </Link>
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((e) => (
                <tr key={e.id}>
                  <td>
                    <Link href={`/envelopes/${e.id}`} className="font-medium text-accent hover:underline">{e.name}</Link>
                    {e.description ? <div className="max-w-md truncate text-xs text-ink-muted">{e.description}</div> : null}
                  </td>
                  <td>{e.modality}</td>
                  <td className="font-mono text-xs">{e.updatedAt.toISOString().slice(0, 16).replace('T', ' ')}</td>
                  <td className="font-mono text-xs">{e.createdAt.toISOString().slice(0, 10)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
