import { PageHeader } from '@/components/ui/PageHeader';
import { listMembers, listOpenInvitations } from '@/db/queries/members';
import { requireMember } from '@/lib/auth/guard';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { InviteForm } from './InviteForm';
import { RoleEditor } from './RoleEditor';

export default async function MembersPage() {
  const member = await requireMember('members.manage');
  const [members, invites] = await Promise.all([
    listMembers({ labId: member.lab.id }),
    listOpenInvitations({ labId: member.lab.id }),
  ]);
  return (
    <>
      <PageHeader title="Members" lead="Roles decide who designs protocols, who reviews them, and who manages rigs and people." />
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <div className="card overflow-x-auto p-0">
          <table className="table">
            <thead><tr><th>Person</th><th>Roles</th></tr></thead>
            <tbody>
              {members.map((m) => (
                <tr key={m.userId}>
                  <td><div className="font-medium">{m.name ?? m.email}</div><div className="text-xs text-ink-muted">{m.email}</div></td>
                  <td><RoleEditor userId={m.userId} roles={m.roles} label={m.name ?? m.email ?? ''} /></td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <div className="space-y-6">
          <InviteForm />
          <section className="card">
            <h2 className="text-base">Open invitations</h2>
            {invites.length === 0 ? (
              <p className="mt-2 text-sm text-ink-muted">None. Invitations you send wait here until they are accepted.</p>
            ) : (
              <ul className="mt-2 space-y-1 text-sm">
                {invites.map((i) => (
                  <li key={i.id}>
                    {i.email} — {i.roles.map((r) => ROLE_LABELS[r]).join(', ')}
                    <span className="text-xs text-ink-muted"> (expires {i.expiresAt.toISOString().slice(0, 10)})</span>
                  </li>
                ))}
              </ul>
            )}
          </section>
        </div>
      </div>
    </>
  );
}
