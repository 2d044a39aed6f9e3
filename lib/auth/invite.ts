import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { invitations } from '@/db/schema';
import { recordAudit } from '@/db/queries/audit';
import { enqueueMail } from '@/lib/mail/outbox';
import { invitationMessage } from '@/lib/mail/templates';
import { hashSecret, newSecret } from './tokens';
import { ROLE_LABELS, type Role } from './roles';

type Tx = Pick<PgDatabase<PgQueryResultHKT, Record<string, unknown>>, 'insert'>;
const INVITATION_DAYS = 7;

/**
 * Writes the invitation, its e-mail (outbox) and the audit row in the caller's transaction.
 * The link secret exists only in the queued e-mail.
 */
export async function createInvitationWith(
  tx: Tx,
  args: {
    lab: { id: string; name: string };
    email: string;
    roles: Role[];
    invitedBy: { id: string; email: string };
    appUrl: string;
    ip?: string;
  },
): Promise<{ id: string; url: string }> {
  const secret = newSecret('inv_');
  const [row] = await tx
    .insert(invitations)
    .values({
      labId: args.lab.id,
      email: args.email.toLowerCase(),
      roles: args.roles,
      tokenHash: hashSecret(secret),
      invitedBy: args.invitedBy.id,
      expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
    })
    .returning({ id: invitations.id });
  const url = `${args.appUrl.replace(/\/$/, '')}/invite/${secret}`;
  await enqueueMail(tx, args.lab.id, args.email, invitationMessage(args.lab.name, args.roles.map((r) => ROLE_LABELS[r]), url));
  await recordAudit(tx, {
    labId: args.lab.id,
    actor: { userId: args.invitedBy.id, label: args.invitedBy.email },
    action: 'member.invited',
    subjectType: 'invitation',
    subjectId: row!.id,
    ip: args.ip,
    details: { email: args.email, roles: args.roles },
  });
  return { id: row!.id, url };
}
