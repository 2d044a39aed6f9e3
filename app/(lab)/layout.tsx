import Link from 'next/link';
import { Logo } from '@/components/ui/Logo';
import { SignOutButton } from '@/components/ui/SignOutButton';
import { requireMember } from '@/lib/auth/guard';
import { may, ROLE_LABELS } from '@/lib/auth/roles';
import { devMailboxEnabled } from '@/lib/env';
import { isDatabaseUnavailable } from '@/lib/db-errors';
import type { Member } from '@/lib/auth/session';
import { switchLabAction } from './actions';
import { LabNav } from './LabNav';
import { NAV } from './nav';

export default async function LabLayout({ children }: { children: React.ReactNode }) {
  let member: Member;
  try {
    member = await requireMember();
  } catch (err) {
    if (isDatabaseUnavailable(err)) return <DatabaseDown />;
    throw err; // redirects and 403s are thrown too; they pass through
  }
  const items = NAV.filter((n) => may(member.roles, n.permission)).map(({ href, label }) => ({ href, label }));
  return (
    <div className="min-h-screen">
      <header className="border-b border-line bg-panel">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-6 py-3">
          <Link href="/" className="text-accent"><Logo /></Link>
          <div className="flex items-center gap-2 text-sm">
            {member.labs.length > 1 ? (
              <form action={switchLabAction} className="flex items-center gap-2">
                <label htmlFor="lab-switch" className="sr-only">Current lab</label>
                <select id="lab-switch" name="labId" defaultValue={member.lab.id} className="field w-auto py-1">
                  {member.labs.map((l) => (
                    <option key={l.labId} value={l.labId}>{l.labName}</option>
                  ))}
                </select>
                <button type="submit" className="btn py-1">Switch</button>
              </form>
            ) : (
              <span className="font-medium" data-testid="lab-name">{member.lab.name}</span>
            )}
          </div>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span className="text-ink-muted" data-testid="user-roles">
              {member.user.name ?? member.user.email} · {member.roles.map((r) => ROLE_LABELS[r]).join(', ')}
            </span>
            {devMailboxEnabled() ? <Link href="/dev/mailbox" className="text-ink-muted underline">Mailbox</Link> : null}
            <SignOutButton />
          </div>
        </div>
        <div className="mx-auto max-w-7xl px-6 pb-2">
          <LabNav items={items} />
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-6 py-8">{children}</main>
    </div>
  );
}

function DatabaseDown() {
  return (
    <main className="mx-auto max-w-md px-6 py-24 text-center">
      <h1>The database is not answering</h1>
      <p className="mt-2 text-sm text-ink-muted">
        Pulseloom cannot reach its PostgreSQL server, so nothing can be shown or saved. Restart Pulseloom with
        <code className="mx-1 font-mono">npm start</code>, or ask whoever runs this installation to check the database.
      </p>
    </main>
  );
}
