/** Rig records: create, edit under the rules that protect approved schedules, archive; every change audited. */
import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { auditLog, rigs } from '@/db/schema';
import { listRigTokens } from '@/db/queries/rigs';
import { AppError } from '@/lib/http/errors';
import { createRig, createRigToken, revokeRigToken, setRigArchived, updateRig } from '@/lib/rigs/manage';
import type { RigValues } from '@/lib/rigs/schema';
import { makeLab } from './support/fixtures';
import { makeVersion, smallSpec } from './support/rig-fixtures';

const optical = (name: string): RigValues => ({
  modality: 'optical',
  name,
  clockHz: 10_000,
  channels: 2,
  notes: '',
  wavelengthNm: 473,
  fibreCoreUm: 200,
  fibreNA: 0.39,
});

async function setup() {
  const t = await makeLab();
  const admin = { labId: t.lab.id, userId: t.people.admin!.id, email: t.people.admin!.email, ip: '127.0.0.1' };
  return { ...t, admin };
}

const failure = (p: Promise<unknown>) => p.then(() => null, (e: unknown) => e as AppError);
const auditsOf = (subjectId: string) => db.select().from(auditLog).where(eq(auditLog.subjectId, subjectId));

describe('rig records', () => {
  it('are created with only their modality’s columns and an audit row', async () => {
    const t = await setup();
    const rig = await createRig(t.admin, optical(`Bench ${t.tag}`));
    expect(rig).toMatchObject({ labId: t.lab.id, modality: 'optical', wavelengthNm: 473, electrodeMaterial: null });
    const [a] = await auditsOf(rig.id);
    expect(a).toMatchObject({ action: 'rig.created', actorUserId: t.admin.userId, labId: t.lab.id });

    const dup = await failure(createRig(t.admin, optical(`bench ${t.tag}`.toUpperCase())));
    expect(dup?.status).toBe(409);
    expect(dup?.issues[0]?.path).toBe('name');
  });

  it('record what changed; switching modality clears the other modality’s columns', async () => {
    const t = await setup();
    const rig = await createRig(t.admin, optical(`Bench ${t.tag}`));
    const after = await updateRig(t.admin, rig.id, { modality: 'electrical', name: rig.name, clockHz: 30_000, channels: 4, notes: '', electrodeMaterial: 'Pt-Ir', electrodeAreaMm2: 0.0314 });
    expect(after).toMatchObject({ modality: 'electrical', wavelengthNm: null, fibreNA: null, electrodeAreaMm2: 0.0314 });
    const updated = (await auditsOf(rig.id)).find((a) => a.action === 'rig.updated')!;
    expect((updated.details as { changed: Record<string, { from: unknown; to: unknown }> }).changed.clockHz).toEqual({ from: 10_000, to: 30_000 });
  });

  it('keep their clock while submitted or approved schedules are placed on it, and their modality once versions exist', async () => {
    const t = await setup();
    const rig = await createRig(t.admin, optical(`Bench ${t.tag}`));
    await makeVersion({ labId: t.lab.id, rigId: rig.id, spec: smallSpec(), status: 'draft' });
    // Drafts alone: the clock may still change (a draft is re-placed when it is submitted).
    await updateRig(t.admin, rig.id, { ...optical(rig.name), clockHz: 20_000 });
    const modality = await failure(updateRig(t.admin, rig.id, { modality: 'electrical', name: rig.name, clockHz: 20_000, channels: 2, notes: '', electrodeMaterial: 'Pt', electrodeAreaMm2: 1 }));
    expect(modality?.issues[0]?.path).toBe('modality');

    await makeVersion({ labId: t.lab.id, rigId: rig.id, spec: smallSpec(undefined, 20_000), status: 'approved', number: 1 });
    const clock = await failure(updateRig(t.admin, rig.id, { ...optical(rig.name), clockHz: 10_000 }));
    expect(clock?.status).toBe(409);
    expect(clock?.issues[0]?.path).toBe('clockHz');
    // Other fields still change.
    await updateRig(t.admin, rig.id, { ...optical(rig.name), clockHz: 20_000, notes: 'new patch cord' });
    const [row] = await db.select().from(rigs).where(eq(rigs.id, rig.id));
    expect(row!.notes).toBe('new patch cord');
  });

  it('are archived and restored, never deleted, and stay inside their lab', async () => {
    const t = await setup();
    const other = await setup();
    const rig = await createRig(t.admin, optical(`Bench ${t.tag}`));
    expect((await failure(setRigArchived(other.admin, rig.id, true)))?.status).toBe(404);
    expect((await failure(updateRig(other.admin, rig.id, optical('x'))))?.status).toBe(404);
    expect((await failure(createRigToken(other.admin, { rigId: rig.id, name: 'x', expiresInDays: 1 })))?.status).toBe(404);

    await setRigArchived(t.admin, rig.id, true);
    expect((await failure(createRigToken(t.admin, { rigId: rig.id, name: 'x', expiresInDays: 1 })))?.status).toBe(409);
    await setRigArchived(t.admin, rig.id, false);
    const actions = (await auditsOf(rig.id)).map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(['rig.created', 'rig.archived', 'rig.restored']));
  });
});

describe('rig tokens', () => {
  it('list with their status; revoking twice records one revocation; another lab cannot revoke', async () => {
    const t = await setup();
    const other = await setup();
    const rig = await createRig(t.admin, optical(`Bench ${t.tag}`));
    const tok = await createRigToken(t.admin, { rigId: rig.id, name: 'acquisition PC', expiresInDays: 90 });
    const expectedExpiry = Date.now() + 90 * 86_400_000;
    expect(Math.abs(tok.expiresAt.getTime() - expectedExpiry)).toBeLessThan(60_000);

    expect((await failure(revokeRigToken(other.admin, { rigId: rig.id, tokenId: tok.id })))?.status).toBe(404);
    expect((await listRigTokens({ labId: t.lab.id, rigId: rig.id }))[0]).toMatchObject({ name: 'acquisition PC', status: 'active', lastUsedAt: null });
    await revokeRigToken(t.admin, { rigId: rig.id, tokenId: tok.id });
    await revokeRigToken(t.admin, { rigId: rig.id, tokenId: tok.id });
    expect((await listRigTokens({ labId: t.lab.id, rigId: rig.id }))[0]!.status).toBe('revoked');
    const revocations = await db.select().from(auditLog).where(and(eq(auditLog.subjectId, tok.id), eq(auditLog.action, 'rig_token.revoked')));
    expect(revocations).toHaveLength(1);
    expect(await listRigTokens({ labId: other.lab.id, rigId: rig.id })).toEqual([]);
  });
});
