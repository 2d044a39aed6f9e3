import { eq } from 'drizzle-orm';
import { db } from '@/db/client';
import { labs } from '@/db/schema';
import { Logo } from '@/components/ui/Logo';
import { findOpenInvitation } from '@/lib/auth/invitations';
import { ROLE_LABELS } from '@/lib/auth/roles';
import { AcceptForm } from './AcceptForm';

export default async function InvitationPage({ params }: PageProps<'/invite/[token]'>) {
  const { token } = await params;
  const inv = await findOpenInvitation(token);
  if (!inv) {
    return (
      <main className="mx-auto max-w-md px-6 py-24 text-center">
        <Logo className="text-accent" />
        <h1 className="mt-6">This invitation cannot be used</h1>
        <p className="mt-2 text-sm text-ink-muted">It has expired or was already used. Ask your lab admin for a new one.</p>
      </main>
    );
  }
  const [lab] = await db.select({ name: labs.name }).from(labs).where(eq(labs.id, inv.labId)).limit(1);
  return (
    <main className="mx-auto max-w-md px-6 py-24 text-center">
      <Logo className="text-accent" />
      <h1 className="mt-6">Join {lab?.name}</h1>
      <p className="mt-2 text-sm text-ink-muted">
        {inv.email} is invited as {inv.roles.map((r) => ROLE_LABELS[r]).join(', ')}.
      </p>
      <AcceptForm token={token} />
    </main>
  );
}
