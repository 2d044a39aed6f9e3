import type { VersionRow } from '@/db/queries/versions';
import { formatWhen } from './CommentList';

/** Who wrote a version, where it runs, and the record of its submission and decision. */
export function VersionFacts({ v }: { v: VersionRow }) {
  return (
    <dl className="grid gap-x-8 gap-y-3 text-sm sm:grid-cols-2 lg:grid-cols-3" data-testid="version-facts">
      <Fact label="Rig">{v.rigName ? `${v.rigName} — ${v.rigClockHz?.toLocaleString('en')} Hz clock` : 'Not chosen yet'}</Fact>
      <Fact label="Author">{v.authorName ?? v.authorEmail ?? '—'}</Fact>
      <Fact label="Created">{formatWhen(v.createdAt)}</Fact>
      <Fact label="Submitted">{formatWhen(v.submittedAt)}</Fact>
      <Fact label={v.status === 'approved' || (v.status === 'withdrawn' && v.approvedChecksum) ? 'Approved' : 'Decided'}>
        {v.decidedAt ? `${formatWhen(v.decidedAt)} by ${v.deciderName ?? v.deciderEmail ?? 'someone'}` : '—'}
      </Fact>
      <Fact label="Schedule checksum">
        {v.checksum ? <code className="break-all font-mono text-xs" data-testid="checksum">{v.checksum}</code> : <span className="text-ink-muted">Recorded at submission</span>}
      </Fact>
      {v.approvedChecksum ? (
        <Fact label="Approved checksum">
          <code className="break-all font-mono text-xs" data-testid="approved-checksum">{v.approvedChecksum}</code>
        </Fact>
      ) : null}
    </dl>
  );
}

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="label">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}
