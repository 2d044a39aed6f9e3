import { describe, expect, it } from 'vitest';
import { and, eq, inArray, isNull } from 'drizzle-orm';
import { db } from '@/db/client';
import { outbox } from '@/db/schema';
import { deliverOutbox } from '@/lib/mail/outbox';
import { decideVersion, submitVersion } from '@/lib/versions/workflow';
import { CTX, FAIL_SPEC, makeDraft, makeReviewLab, outboxFor, versionRow } from './support/review-workflow';

describe('review e-mail through the outbox', () => {
  it('queues one message per safety officer who did not write the version, in the submit transaction', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    const res = await submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    const rows = await outboxFor(t.lab.id);
    // officer, officer2 and "both" (experimenter + officer) are officers; the author is not.
    expect(rows.map((r) => r.to).sort()).toEqual([t.as.both.user.email, t.as.officer.user.email, t.as.officer2.user.email].sort());
    expect(res.notified).toBe(3);
    for (const r of rows) {
      expect(r.subject).toMatch(/^Review requested: P \w+ v1$/);
      expect(r.text).toContain(`${CTX.appUrl}/reviews/${versionId}`);
      expect(r.html).toContain(`href="${CTX.appUrl}/reviews/${versionId}"`);
      expect(r.sentAt).toBeNull();
    }
  });

  it('leaves the submitting officer-experimenter out of their own review request', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t, undefined, t.as.both);
    await submitVersion(t.as.both, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    expect((await outboxFor(t.lab.id)).map((r) => r.to).sort()).toEqual([t.as.officer.user.email, t.as.officer2.user.email].sort());
  });

  it('queues nothing when the change is refused', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t, FAIL_SPEC);
    await expect(submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: 'x' }, CTX)).rejects.toMatchObject({ status: 422 });
    expect(await outboxFor(t.lab.id)).toEqual([]);
  });

  it('sends the decision and the comments to the author, with a link to the version', async () => {
    const t = await makeReviewLab();
    const { versionId, protocolId } = await makeDraft(t);
    await submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    await decideVersion(t.as.officer, { versionId, revision: (await versionRow(versionId)).revision, decision: 'return', comment: 'Ramp to 8 Hz, not 12.' }, CTX);
    const [mail, ...more] = await outboxFor(t.lab.id, t.as.author.user.email);
    expect(more).toEqual([]);
    expect(mail!.subject).toMatch(/^Returned: /);
    expect(mail!.text).toContain('Ramp to 8 Hz, not 12.');
    expect(mail!.text).toContain(`${CTX.appUrl}/protocols/${protocolId}/versions/1`);
    expect(mail!.html).toContain('Ramp to 8 Hz, not 12.');
  });

  it('escapes the comment in the HTML part', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    await submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    await decideVersion(t.as.officer, { versionId, revision: (await versionRow(versionId)).revision, decision: 'return', comment: '<b>peak</b> & width' }, CTX);
    const [mail] = await outboxFor(t.lab.id, t.as.author.user.email);
    expect(mail!.html).toContain('&lt;b&gt;peak&lt;/b&gt; &amp; width');
    expect(mail!.html).not.toContain('<b>peak</b>');
  });

  it('a failing SMTP server never undoes the approval; the message is retried and sent later', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    await submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    await decideVersion(t.as.officer, { versionId, revision: (await versionRow(versionId)).revision, decision: 'approve', comment: '' }, CTX);
    const ours = (await outboxFor(t.lab.id)).map((r) => r.id);
    expect(ours.length).toBe(4); // three review requests, one approval

    const mine = new Set((await outboxFor(t.lab.id)).map((r) => r.to));
    const down = async (m: { to: string }) => {
      if (mine.has(m.to)) throw new Error('421 service not available');
    };
    await deliverOutbox(down, 10_000);
    const failed = await db.select().from(outbox).where(inArray(outbox.id, ours));
    for (const r of failed) expect(r).toMatchObject({ sentAt: null, attempts: 1, lastError: '421 service not available' });
    expect(failed.every((r) => r.nextAttemptAt.getTime() > Date.now())).toBe(true);
    expect((await versionRow(versionId)).status).toBe('approved');

    // Time passes; the server is back.
    await db.update(outbox).set({ nextAttemptAt: new Date() }).where(and(inArray(outbox.id, ours), isNull(outbox.sentAt)));
    const sent: { to: string; subject: string }[] = [];
    await deliverOutbox(async (m) => void sent.push(m), 10_000);
    const approval = sent.find((m) => m.to === t.as.author.user.email);
    expect(approval?.subject).toMatch(/^Approved: /);
    const done = await db.select().from(outbox).where(inArray(outbox.id, ours));
    for (const r of done) expect(r.sentAt).not.toBeNull();
    expect(done.every((r) => r.attempts === 2)).toBe(true);
    expect((await db.select().from(outbox).where(eq(outbox.id, ours[0]!)))[0]!.lastError).toBeNull();
  });
});
