import { describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { db } from '@/db/client';
import { protocolVersions, reviewComments } from '@/db/schema';
import { scanSchedule } from '@/lib/schedule';
import type { Member } from '@/lib/auth/session';
import {
  copyVersion,
  decideVersion,
  saveDraftSpec,
  setDraftRig,
  submitVersion,
  withdrawVersion,
} from '@/lib/versions/workflow';
import type { VersionStatus } from '@/lib/versions/status';
import { makeLab } from './support/fixtures';
import {
  CLEAN_SPEC,
  CTX,
  FAIL_SPEC,
  WARN_SPEC,
  auditFor,
  makeDraft,
  makeReviewLab,
  outcome,
  versionRow,
  type Actors,
} from './support/review-workflow';

type Lab = Awaited<ReturnType<typeof makeReviewLab>>;
type Action = 'edit' | 'submit' | 'approve' | 'return' | 'withdraw' | 'copy';

/** Brings a fresh v1 (authored and submitted by `author`) into the state asked for. */
async function versionIn(t: Lab, state: VersionStatus) {
  const { versionId } = await makeDraft(t);
  const rev = async () => (await versionRow(versionId)).revision;
  if (state === 'draft') return versionId;
  await submitVersion(t.as.author, { versionId, revision: await rev(), justification: '' }, CTX);
  if (state === 'in_review') return versionId;
  if (state === 'withdrawn') {
    await withdrawVersion(t.as.author, { versionId, revision: await rev(), reason: 'pulled back' }, CTX);
    return versionId;
  }
  await decideVersion(
    t.as.officer2,
    { versionId, revision: await rev(), decision: state === 'approved' ? 'approve' : 'return', comment: state === 'returned' ? 'shorter ramp' : '' },
    CTX,
  );
  return versionId;
}

async function act(t: Lab, action: Action, who: Member, versionId: string) {
  const revision = (await versionRow(versionId)).revision;
  switch (action) {
    case 'edit':
      return saveDraftSpec(who, { versionId, spec: { ...CLEAN_SPEC, seed: 'edited' } }, CTX);
    case 'submit':
      return submitVersion(who, { versionId, revision, justification: '' }, CTX);
    case 'approve':
    case 'return':
      return decideVersion(who, { versionId, revision, decision: action, comment: 'looked at it' }, CTX);
    case 'withdraw':
      return withdrawVersion(who, { versionId, revision, reason: 'no longer needed' }, CTX);
    case 'copy':
      return copyVersion(who, { versionId }, CTX);
  }
}

// What the brief allows, by hand. "author" wrote and submitted the version; "colleague" is
// another experimenter; "officer" a safety officer who did not touch it; "admin" a lab admin.
const ALLOWED: Record<VersionStatus, Partial<Record<Action, (keyof Actors)[]>>> = {
  draft: { edit: ['author', 'colleague'], submit: ['author', 'colleague'] },
  in_review: { approve: ['officer'], return: ['officer'], withdraw: ['author'] },
  approved: { withdraw: ['officer'], copy: ['author', 'colleague'] },
  returned: { copy: ['author', 'colleague'] },
  withdrawn: { copy: ['author', 'colleague'] },
};
const AFTER: Partial<Record<Action, VersionStatus>> = { edit: 'draft', submit: 'in_review', approve: 'approved', return: 'returned', withdraw: 'withdrawn' };

describe('every transition by every role', () => {
  const states: VersionStatus[] = ['draft', 'in_review', 'approved', 'returned', 'withdrawn'];
  const actions: Action[] = ['edit', 'submit', 'approve', 'return', 'withdraw', 'copy'];
  const who: (keyof Actors)[] = ['author', 'colleague', 'officer', 'admin'];
  for (const state of states) {
    it(`from ${state}: allowed ones change the row and write the audit log; the rest change nothing`, async () => {
      const t = await makeReviewLab();
      for (const action of actions) {
        for (const w of who) {
          const versionId = await versionIn(t, state);
          const before = await versionRow(versionId);
          const auditBefore = (await auditFor(versionId)).length;
          const expected = ALLOWED[state][action]?.includes(w) ?? false;
          const got = await outcome(act(t, action, t.as[w], versionId));
          const label = `${w} ${action} on ${state}`;
          const after = await versionRow(versionId);
          if (expected) {
            expect(got, label).toBe('ok');
            if (action === 'copy') {
              expect(after, label).toEqual(before); // the source stays as it was
            } else {
              expect(after.status, label).toBe(AFTER[action]);
              expect(after.revision, label).toBe(before.revision + 1);
              const audit = await auditFor(versionId);
              expect(audit.length, label).toBe(auditBefore + 1);
              expect(audit.at(-1)!.actorUserId, label).toBe(t.as[w].user.id);
              expect(audit.at(-1)!.ip, label).toBe(CTX.ip);
            }
          } else {
            expect([403, 409], label).toContain(got);
            expect(after, label).toEqual(before);
            expect((await auditFor(versionId)).length, label).toBe(auditBefore);
          }
        }
      }
    });
  }

  it('refuses every action to a member of another lab as not found', async () => {
    const t = await makeReviewLab();
    const other = await makeLab({ x: ['experimenter', 'safety_officer', 'lab_admin'] });
    const stranger: Member = {
      user: { id: other.people.x!.id, email: other.people.x!.email, name: 'x' },
      lab: { id: other.lab.id, name: other.lab.name, slug: other.lab.slug },
      roles: ['experimenter', 'safety_officer', 'lab_admin'],
      labs: [],
    };
    const draft = await versionIn(t, 'draft');
    const review = await versionIn(t, 'in_review');
    for (const [action, id] of [['edit', draft], ['submit', draft], ['approve', review], ['return', review], ['withdraw', review], ['copy', review]] as const) {
      expect(await outcome(act(t, action, stranger, id)), action).toBe(404);
    }
  });
});

describe('separation of duties', () => {
  it('an author who is also a safety officer cannot approve or return their own version; another officer can', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t, CLEAN_SPEC, t.as.both);
    await submitVersion(t.as.both, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    const revision = (await versionRow(versionId)).revision;
    const refused = await decideVersion(t.as.both, { versionId, revision, decision: 'approve', comment: '' }, CTX).catch((e) => e);
    expect(refused.status).toBe(403);
    expect(refused.message).toMatch(/another safety officer must decide it/);
    expect(await outcome(decideVersion(t.as.both, { versionId, revision, decision: 'return', comment: 'mine' }, CTX))).toBe(403);
    expect((await versionRow(versionId)).status).toBe('in_review');
    await decideVersion(t.as.officer, { versionId, revision, decision: 'approve', comment: '' }, CTX);
    expect((await versionRow(versionId)).decidedBy).toBe(t.as.officer.user.id);
  });

  it('an officer-experimenter who only edited someone else’s draft cannot decide it either', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t); // written by author
    await saveDraftSpec(t.as.both, { versionId, spec: { ...CLEAN_SPEC, trials: 5 } }, CTX);
    await submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    const revision = (await versionRow(versionId)).revision;
    expect(await outcome(decideVersion(t.as.both, { versionId, revision, decision: 'approve', comment: '' }, CTX))).toBe(403);
  });
});

describe('drafts', () => {
  it('keep the rig’s clock: a typed clock is refused, a rig change brings its own', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    const err = await saveDraftSpec(t.as.author, { versionId, spec: { ...CLEAN_SPEC, clockHz: 44_100 } }, CTX).catch((e) => e);
    expect(err.status).toBe(400);
    expect(err.issues).toEqual([{ path: 'spec.clockHz', message: expect.stringContaining(`must be ${t.rig.clockHz} Hz`) }]);
    expect((await versionRow(versionId)).spec).toMatchObject({ clockHz: t.rig.clockHz });
    await setDraftRig(t.as.author, { versionId, rigId: t.rig2.id }, CTX);
    const row = await versionRow(versionId);
    expect(row.rigId).toBe(t.rig2.id);
    expect(row.spec).toMatchObject({ clockHz: 20_000 });
  });

  it('refuse an invalid spec with the engine’s paths and write nothing', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    const before = await versionRow(versionId);
    const err = await saveDraftSpec(t.as.author, { versionId, spec: { ...CLEAN_SPEC, ceilingHz: 5 } }, CTX).catch((e) => e);
    expect(err.status).toBe(400);
    expect(err.issues.map((i: { path: string }) => i.path)).toContain('spec.envelope[0].toHz');
    expect(await versionRow(versionId)).toEqual(before);
  });

  it('refuse a rig that is not one of the protocol’s', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    const other = await makeReviewLab();
    const err = await setDraftRig(t.as.author, { versionId, rigId: other.rig.id }, CTX).catch((e) => e);
    expect(err.status).toBe(400);
    expect(err.issues[0].path).toBe('rigId');
  });
});

describe('submission', () => {
  it('stores the schedule checksum the engine computes, and audits it', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    const res = await submitVersion(t.as.author, { versionId, revision: (await versionRow(versionId)).revision, justification: '' }, CTX);
    const row = await versionRow(versionId);
    expect(row.status).toBe('in_review');
    const scan = scanSchedule({ ...CLEAN_SPEC, clockHz: t.rig.clockHz });
    expect(row.checksum).toBe(scan.checksum);
    expect(row.pulseCount).toBe(scan.pulseCount);
    expect(row.pulseCount).toBeGreaterThan(0);
    expect(row.checksum).toMatch(/^sha256:[0-9a-f]{64}$/);
    expect(res.checksum).toBe(row.checksum);
    const audit = (await auditFor(versionId)).find((a) => a.action === 'version.submitted')!;
    expect(audit).toMatchObject({ checksum: row.checksum, ip: CTX.ip, actorLabel: t.as.author.user.email });
  });

  it('refuses a version that fails a hard limit, naming the row', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t, FAIL_SPEC);
    const before = await versionRow(versionId);
    const err = await submitVersion(t.as.author, { versionId, revision: before.revision, justification: 'please' }, CTX).catch((e) => e);
    expect(err.status).toBe(422);
    expect(err.issues.map((i: { path: string }) => i.path)).toContain('safety.peak-power');
    expect(await versionRow(versionId)).toEqual(before);
  });

  it('asks for a written justification at warning level, and keeps it', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t, WARN_SPEC);
    const revision = (await versionRow(versionId)).revision;
    const err = await submitVersion(t.as.author, { versionId, revision, justification: '  ' }, CTX).catch((e) => e);
    expect(err.status).toBe(400);
    expect(err.issues[0].path).toBe('justification');
    await submitVersion(t.as.author, { versionId, revision, justification: 'Opsin expression is weak in this cohort.' }, CTX);
    expect(await versionRow(versionId)).toMatchObject({ status: 'in_review', justification: 'Opsin expression is weak in this cohort.' });
  });

  it('refuses a stale revision with the conflict message', async () => {
    const t = await makeReviewLab();
    const { versionId } = await makeDraft(t);
    const stale = (await versionRow(versionId)).revision;
    await saveDraftSpec(t.as.colleague, { versionId, spec: { ...CLEAN_SPEC, trials: 3 } }, CTX);
    const err = await submitVersion(t.as.author, { versionId, revision: stale, justification: '' }, CTX).catch((e) => e);
    expect(err.status).toBe(409);
    expect(err.message).toBe('Someone else acted on this version first; reload to see its state.');
  });
});

describe('approval', () => {
  it('records who, when and the checksum, and a decision comment', async () => {
    const t = await makeReviewLab();
    const versionId = await versionIn(t, 'in_review');
    const submitted = await versionRow(versionId);
    const t0 = Date.now();
    await decideVersion(t.as.officer, { versionId, revision: submitted.revision, decision: 'approve', comment: 'fine' }, CTX);
    const row = await versionRow(versionId);
    expect(row).toMatchObject({ status: 'approved', decidedBy: t.as.officer.user.id, approvedChecksum: submitted.checksum, pulseCount: submitted.pulseCount });
    expect(row.decidedAt!.getTime()).toBeGreaterThanOrEqual(t0 - 1000);
    const comments = await db.select().from(reviewComments).where(eq(reviewComments.versionId, versionId));
    expect(comments).toMatchObject([{ decision: 'approve', body: 'fine', authorId: t.as.officer.user.id }]);
    expect((await auditFor(versionId)).at(-1)).toMatchObject({ action: 'version.approved', checksum: submitted.checksum });
  });

  it('copies a returned version into a new draft n+1; the returned one stays', async () => {
    const t = await makeReviewLab();
    const versionId = await versionIn(t, 'returned');
    const before = await versionRow(versionId);
    const res = await copyVersion(t.as.author, { versionId }, CTX);
    expect(res.number).toBe(2);
    const copy = await versionRow(res.versionId);
    expect(copy).toMatchObject({ status: 'draft', number: 2, copiedFromId: versionId, spec: before.spec, rigId: before.rigId, checksum: null });
    expect(await versionRow(versionId)).toEqual(before);
  });

  it('numbers two copies made at once 2 and 3', async () => {
    const t = await makeReviewLab();
    const versionId = await versionIn(t, 'returned');
    const [a, b] = await Promise.all([copyVersion(t.as.author, { versionId }, CTX), copyVersion(t.as.colleague, { versionId }, CTX)]);
    expect([a.number, b.number].sort()).toEqual([2, 3]);
  });
});

describe('the database guards approved versions', () => {
  it('rejects a direct UPDATE of an approved row, whatever the column', async () => {
    const t = await makeReviewLab();
    const versionId = await versionIn(t, 'approved');
    const before = await versionRow(versionId);
    const attempts = [
      sql`update protocol_versions set spec = jsonb_set(spec, '{pulse,amplitude}', '29') where id = ${versionId}`,
      sql`update protocol_versions set status = 'draft' where id = ${versionId}`,
      sql`update protocol_versions set justification = 'edited later' where id = ${versionId}`,
      sql`update protocol_versions set approved_checksum = 'sha256:00' where id = ${versionId}`,
      sql`update protocol_versions set pulse_count = pulse_count + 1 where id = ${versionId}`,
      sql`update protocol_versions set status = 'withdrawn', pulse_count = 1 where id = ${versionId}`,
      sql`delete from protocol_versions where id = ${versionId}`,
    ];
    for (const q of attempts) {
      const err = await db.execute(q).then(() => null, (e: { cause?: { message: string }; message: string }) => e);
      expect(err, String(q.queryChunks[0])).not.toBeNull();
      expect(err!.cause?.message ?? err!.message).toMatch(/approved and immutable|cannot be deleted/);
    }
    expect(await versionRow(versionId)).toEqual(before);
  });

  it('lets an approved row become withdrawn and nothing else', async () => {
    const t = await makeReviewLab();
    const versionId = await versionIn(t, 'approved');
    await db.execute(sql`update protocol_versions set status = 'withdrawn' where id = ${versionId}`);
    expect((await versionRow(versionId)).status).toBe('withdrawn');
  });

  it('freezes the spec once submitted', async () => {
    const t = await makeReviewLab();
    const versionId = await versionIn(t, 'in_review');
    const err = await db
      .update(protocolVersions)
      .set({ spec: { ...CLEAN_SPEC, trials: 9 } })
      .where(eq(protocolVersions.id, versionId))
      .then(() => null, (e: { cause?: { message: string } }) => e);
    expect(err?.cause?.message).toMatch(/spec is frozen/);
  });
});
