import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { db } from '@/db/client';
import { reviewComments } from '@/db/schema';
import { transitionVersion } from '@/db/queries/versions';
import { CONFLICT_MESSAGE, decideVersion, submitVersion } from '@/lib/versions/workflow';
import { CTX, auditFor, makeDraft, makeReviewLab, outboxFor, versionRow } from './support/review-workflow';

async function inReview() {
  const t = await makeReviewLab();
  const { versionId } = await makeDraft(t);
  await submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
  return { t, versionId, row: await versionRow(versionId) };
}

async function waitUntil(check: () => Promise<boolean>, timeoutMs = 5000) {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 20));
  }
  throw new Error('condition not reached');
}

describe('two officers acting on the same version at once', () => {
  it('exactly one wins; the other gets the conflict message and leaves no trace', async () => {
    const { t, versionId, row } = await inReview();
    const results = await Promise.allSettled([
      decideVersion(t.as.officer, { versionId, revision: row.revision, decision: 'approve', comment: 'go' }, CTX),
      decideVersion(t.as.officer2, { versionId, revision: row.revision, decision: 'return', comment: 'not yet' }, CTX),
    ]);
    const won = results.filter((r) => r.status === 'fulfilled');
    const lost = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    expect(lost[0]!.reason).toMatchObject({ status: 409, message: CONFLICT_MESSAGE });

    const winner = results[0]!.status === 'fulfilled' ? 'approve' : 'return';
    const after = await versionRow(versionId);
    expect(after.status).toBe(winner === 'approve' ? 'approved' : 'returned');
    expect(after.revision).toBe(row.revision + 1);
    const comments = await db.select().from(reviewComments).where(eq(reviewComments.versionId, versionId));
    expect(comments.map((c) => c.decision)).toEqual([winner]);
    const decisions = (await auditFor(versionId)).filter((a) => a.action === 'version.approved' || a.action === 'version.returned');
    expect(decisions).toHaveLength(1);
    const toAuthor = await outboxFor(t.lab.id, t.as.author.user.email);
    expect(toAuthor).toHaveLength(1);
    expect(toAuthor[0]!.subject).toMatch(winner === 'approve' ? /^Approved:/ : /^Returned:/);
  });

  it('the second transaction waits on the row lock, then matches nothing (two explicit transactions)', async () => {
    const { t, versionId, row } = await inReview();
    let updated!: () => void;
    const firstUpdated = new Promise<void>((r) => (updated = r));
    let release!: () => void;
    const hold = new Promise<void>((r) => (release = r));

    const first = db.transaction(async (tx) => {
      const r = await transitionVersion(tx, {
        labId: t.lab.id,
        versionId,
        revision: row.revision,
        from: 'in_review',
        set: { status: 'returned', decidedBy: t.as.officer.user.id, decidedAt: new Date() },
      });
      updated();
      await hold; // keep the row locked until the second transaction is queued behind it
      return r;
    });
    await firstUpdated;
    const second = db.transaction((tx) =>
      transitionVersion(tx, {
        labId: t.lab.id,
        versionId,
        revision: row.revision,
        from: 'in_review',
        set: { status: 'approved', decidedBy: t.as.officer2.user.id, decidedAt: new Date(), approvedChecksum: row.checksum! },
      }),
    );
    await waitUntil(async () => {
      const [r] = (await db.execute(
        sql`select count(*)::int as n from pg_stat_activity where wait_event_type = 'Lock' and datname = current_database()`,
      )) as unknown as { n: number }[];
      return (r?.n ?? 0) >= 1;
    });
    release();
    const [a, b] = await Promise.all([first, second]);
    expect(a).toMatchObject({ status: 'returned', revision: row.revision + 1 });
    expect(b).toBeNull();
    expect(await versionRow(versionId)).toMatchObject({ status: 'returned', decidedBy: t.as.officer.user.id });
  });

  it('an officer working from a stale page loses to one who already decided', async () => {
    const { t, versionId, row } = await inReview();
    await decideVersion(t.as.officer, { versionId, revision: row.revision, decision: 'return', comment: 'lower the peak' }, CTX);
    const err = await decideVersion(t.as.officer2, { versionId, revision: row.revision, decision: 'approve', comment: '' }, CTX).catch((e) => e);
    expect(err).toMatchObject({ status: 409, message: CONFLICT_MESSAGE });
    expect((await versionRow(versionId)).status).toBe('returned');
  });
});
