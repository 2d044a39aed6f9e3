import { describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import { db } from '@/db/client';
import { auditLog, invitations, memberships, outbox, users } from '@/db/schema';
import { createInvitationWith } from '@/lib/auth/invite';
import { acceptInvitation } from '@/lib/auth/invitations';
import { deliverOutbox } from '@/lib/mail/outbox';
import { makeLab } from './support/fixtures';
import { expectDbRefusal } from './support/pg';

function secretFrom(text: string): string {
  const m = text.match(/\/invite\/(inv_[A-Za-z0-9_-]+)/);
  if (!m) throw new Error('no invitation link in the message');
  return m[1]!;
}

describe('invitation flow', () => {
  it('queues the e-mail with the invitation, joins the lab once, and audits it', async () => {
    const { lab, people, tag } = await makeLab();
    const email = `new-${tag}@example.test`;
    const { id } = await db.transaction((tx) =>
      createInvitationWith(tx, {
        lab, email, roles: ['experimenter', 'safety_officer'], invitedBy: people.admin!, appUrl: 'http://127.0.0.1:1',
      }),
    );

    const [mail] = await db.select().from(outbox).where(eq(outbox.to, email));
    expect(mail?.subject).toContain(lab.name);
    expect(mail?.html).toContain('/invite/inv_');
    const secret = secretFrom(mail!.text);
    const [stored] = await db.select().from(invitations).where(eq(invitations.id, id));
    expect(stored!.tokenHash).not.toContain(secret); // only the hash is kept

    const user = await acceptInvitation({ token: secret, name: 'Lee Park' });
    expect(user?.email).toBe(email);
    const [m] = await db.select().from(memberships).where(and(eq(memberships.labId, lab.id), eq(memberships.userId, user!.id)));
    expect(m?.roles.sort()).toEqual(['experimenter', 'safety_officer']);

    expect(await acceptInvitation({ token: secret })).toBeNull(); // works exactly once
    const audits = await db.select().from(auditLog).where(and(eq(auditLog.labId, lab.id), eq(auditLog.action, 'member.invited')));
    expect(audits).toHaveLength(1);
  });

  it('merges roles for an existing user and refuses expired or unknown links', async () => {
    const { lab, people } = await makeLab();
    const { people: other } = await makeLab();
    await db.transaction((tx) =>
      createInvitationWith(tx, { lab, email: other.exp!.email, roles: ['safety_officer'], invitedBy: people.admin!, appUrl: 'http://x' }),
    );
    const [mail] = await db.select().from(outbox).where(eq(outbox.to, other.exp!.email));
    const joined = await acceptInvitation({ token: secretFrom(mail!.text) });
    expect(joined?.id).toBe(other.exp!.id);
    const [count] = await db.select({ n: sql<number>`count(*)::int` }).from(users).where(eq(users.email, other.exp!.email));
    expect(count!.n).toBe(1);

    await db.transaction((tx) =>
      createInvitationWith(tx, { lab, email: 'late@example.test', roles: ['experimenter'], invitedBy: people.admin!, appUrl: 'http://x' }),
    );
    const [late] = await db.select().from(outbox).where(eq(outbox.to, 'late@example.test'));
    await db.update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.email, 'late@example.test'));
    expect(await acceptInvitation({ token: secretFrom(late!.text) })).toBeNull();
    expect(await acceptInvitation({ token: 'inv_not-a-real-token' })).toBeNull();
  });
});

describe('outbox delivery', () => {
  it('retries a failed send later and never loses the message', async () => {
    const { lab, people, tag } = await makeLab();
    const email = `retry-${tag}@example.test`;
    await db.transaction((tx) =>
      createInvitationWith(tx, { lab, email, roles: ['experimenter'], invitedBy: people.admin!, appUrl: 'http://x' }),
    );
    const failing = async (m: { to: string }) => {
      if (m.to === email) throw new Error('SMTP down');
    };
    await deliverOutbox(failing, 200);
    const [after] = await db.select().from(outbox).where(eq(outbox.to, email));
    expect(after!.sentAt).toBeNull();
    expect(after!.attempts).toBe(1);
    expect(after!.lastError).toContain('SMTP down');
    expect(after!.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());

    await db.update(outbox).set({ nextAttemptAt: new Date(0) }).where(eq(outbox.id, after!.id));
    const got: string[] = [];
    await deliverOutbox(async (m) => void got.push(m.to), 200);
    expect(got).toContain(email);
    const [sent] = await db.select().from(outbox).where(eq(outbox.id, after!.id));
    expect(sent!.sentAt).not.toBeNull();
  });
});

describe('audit log', () => {
  it('refuses UPDATE, DELETE and TRUNCATE in the database itself', async () => {
    const { lab, people } = await makeLab();
    await db.transaction((tx) =>
      createInvitationWith(tx, { lab, email: 'audit@example.test', roles: ['experimenter'], invitedBy: people.admin!, appUrl: 'http://x' }),
    );
    await expectDbRefusal(db.execute(sql`UPDATE audit_log SET action = 'x' WHERE lab_id = ${lab.id}`), /append-only/);
    await expectDbRefusal(db.execute(sql`DELETE FROM audit_log WHERE lab_id = ${lab.id}`), /append-only/);
    await expectDbRefusal(db.execute(sql`TRUNCATE audit_log`), /append-only/);
    const rows = await db.select().from(auditLog).where(eq(auditLog.labId, lab.id));
    expect(rows).toHaveLength(1);
  });
});
