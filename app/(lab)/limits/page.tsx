import Link from 'next/link';
import { EmptyState } from '@/components/ui/EmptyState';
import { PageHeader } from '@/components/ui/PageHeader';
import { listLimitProfiles, type StoredLimitProfile } from '@/db/queries/limit-profiles';
import { requireMember } from '@/lib/auth/guard';
import type { Modality } from '@/lib/schedule/spec';
import { DeleteProfileButton } from './DeleteProfileButton';
import { MODALITY_LABEL, limitFieldsFor } from './fields';

export default async function LimitsPage() {
  const member = await requireMember('limits.manage');
  const profiles = await listLimitProfiles({ labId: member.lab.id });
  const modalities: Modality[] = ['optical', 'electrical'];
  return (
    <>
      <PageHeader
        title="Limits"
        lead="The numbers every protocol version is checked against before it can be submitted. A rig’s own profile takes precedence over the lab’s profile for its modality."
        actions={
          <>
            <Link href="/limits/new?modality=optical" className="btn btn-primary">New optical profile</Link>
            <Link href="/limits/new?modality=electrical" className="btn btn-primary">New electrical profile</Link>
          </>
        }
      />
      <div className="space-y-8">
        {modalities.map((m) => {
          const rows = profiles.filter((p) => p.profile.modality === m);
          return (
            <section key={m} aria-labelledby={`limits-${m}`}>
              <h2 id={`limits-${m}`} className="mb-2 text-base">{MODALITY_LABEL[m]}</h2>
              {rows.length === 0 ? (
                <EmptyState title={`No ${m} limits yet`}>
                  Until the lab sets its own, {m} safety sheets use Pulseloom’s demo values and say so.
                </EmptyState>
              ) : (
                <div className="card overflow-x-auto p-0">
                  <table className="table" data-testid={`limits-table-${m}`}>
                    <thead>
                      <tr>
                        <th scope="col">Profile</th>
                        <th scope="col">Applies to</th>
                        <th scope="col">Limits set</th>
                        <th scope="col">Last saved</th>
                        <th scope="col"><span className="sr-only">Actions</span></th>
                      </tr>
                    </thead>
                    <tbody>
                      {rows.map((p) => (
                        <ProfileRow key={p.id} p={p} />
                      ))}
                    </tbody>
                  </table>
                </div>
              )}
            </section>
          );
        })}
      </div>
    </>
  );
}

function ProfileRow({ p }: { p: StoredLimitProfile }) {
  const fields = limitFieldsFor(p.profile.modality);
  const limits = p.profile.limits as Record<string, { hard?: number; warn?: number } | undefined>;
  const set = fields.filter((f) => limits[f.key]?.hard !== undefined || limits[f.key]?.warn !== undefined).length;
  const windowSet = p.profile.limits.window ? 1 : 0;
  return (
    <tr data-profile={p.id}>
      <td>
        <Link href={`/limits/${p.id}`} className="font-medium text-accent underline-offset-2 hover:underline">
          {p.profile.name}
        </Link>
        <div className="text-xs text-ink-muted">
          Unknown values {p.profile.whenUnknown === 'fail' ? 'block submission' : 'ask for a justification'}
        </div>
      </td>
      <td>{p.rigId ? p.rigName ?? 'a rig' : `Every ${p.profile.modality} rig`}</td>
      <td className="tabular-nums">
        {set + windowSet} of {fields.length + 1}
      </td>
      <td className="text-xs text-ink-muted">
        <time dateTime={p.updatedAt.toISOString()}>{p.updatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC</time>
        {p.updatedByEmail ? <div>{p.updatedByEmail}</div> : null}
      </td>
      <td className="whitespace-nowrap text-right">
        <span className="inline-flex gap-2">
          <Link href={`/limits/${p.id}`} className="btn" aria-label={`Edit ${p.profile.name}`}>Edit</Link>
          <DeleteProfileButton id={p.id} name={p.profile.name} />
        </span>
      </td>
    </tr>
  );
}
