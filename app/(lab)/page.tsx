import Link from 'next/link';
import { PageHeader } from '@/components/ui/PageHeader';
import { requireMember } from '@/lib/auth/guard';
import { may } from '@/lib/auth/roles';
import { NAV } from './nav';

const BLURBS: Record<string, string> = {
  '/envelopes': 'Draw rate envelopes and preview the pulse schedules they make.',
  '/protocols': 'Envelopes with pulse parameters, trials, seed and rig, in versions that go to review.',
  '/reviews': 'Versions waiting for a safety officer, with their safety sheets.',
  '/rigs': 'The lab’s rigs, their output clocks, optics or electrodes, and rig tokens.',
  '/audit': 'Every state change, approval, export and rig download.',
  '/members': 'People in the lab, their roles, and invitations.',
};

export default async function OverviewPage() {
  const member = await requireMember();
  const areas = NAV.filter((n) => n.href !== '/' && may(member.roles, n.permission));
  return (
    <>
      <PageHeader title={member.lab.name} lead={`Signed in as ${member.user.email}.`} />
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {areas.map((a) => (
          <li key={a.href}>
            <Link href={a.href} className="card block hover:border-accent">
              <p className="font-semibold">{a.label}</p>
              <p className="mt-1 text-sm text-ink-muted">{BLURBS[a.href]}</p>
            </Link>
          </li>
        ))}
      </ul>
    </>
  );
}
