import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db/client';
import { auditLog, limitProfiles } from '@/db/schema';
import {
  createLimitProfile,
  deleteLimitProfile,
  getLimitProfile,
  listLimitProfiles,
  profileFor,
  updateLimitProfile,
} from '@/db/queries/limit-profiles';
import { computeSafetySheet } from '@/lib/review/sheet';
import { AppError } from '@/lib/http/errors';
import { demoProfileFor, type LimitProfileInput } from '@/lib/safety';
import optical from '@/lib/schedule/examples/optical-ramp-sine.json';
import electrical from '@/lib/schedule/examples/electrical-biphasic.json';
import { makeLab, makeRig } from './support/fixtures';

const actorOf = (p: { id: string; email: string }) => ({ userId: p.id, label: p.email });

const opticalProfile = (over: Partial<Extract<LimitProfileInput, { modality: 'optical' }>> = {}): LimitProfileInput => ({
  name: 'Lab optical',
  modality: 'optical',
  limits: { maxRateHz: { warn: 40, hard: 100 }, maxIrradianceMwPerMm2: { warn: 400, hard: 1000 } },
  ...over,
});

async function refusal(p: Promise<unknown>): Promise<AppError> {
  const err = await p.then(() => null, (e: unknown) => e);
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

describe('limit profiles', () => {
  it('create, read, update and delete stay inside the lab, each with an audit row', async () => {
    const a = await makeLab();
    const b = await makeLab();
    const officer = actorOf(a.people.officer!);
    const created = await createLimitProfile({ labId: a.lab.id, input: opticalProfile({ whenUnknown: 'fail' }), actor: officer });
    expect(created.profile).toMatchObject({ name: 'Lab optical', modality: 'optical', whenUnknown: 'fail', rigId: null });
    expect(created.profile.limits.maxRateHz).toEqual({ warn: 40, hard: 100 });

    // Lab B sees nothing of lab A's profile and cannot change or delete it.
    expect(await listLimitProfiles({ labId: b.lab.id })).toEqual([]);
    expect(await getLimitProfile({ labId: b.lab.id, id: created.id })).toBeNull();
    expect((await refusal(updateLimitProfile({ labId: b.lab.id, id: created.id, input: opticalProfile(), actor: actorOf(b.people.officer!) }))).status).toBe(404);
    expect((await refusal(deleteLimitProfile({ labId: b.lab.id, id: created.id, actor: actorOf(b.people.admin!) }))).status).toBe(404);
    expect(await getLimitProfile({ labId: a.lab.id, id: created.id })).not.toBeNull();

    const updated = await updateLimitProfile({
      labId: a.lab.id,
      id: created.id,
      input: opticalProfile({ name: 'Lab optical v2', limits: { maxRateHz: { hard: 60 } } }),
      actor: { ...actorOf(a.people.admin!), ip: '10.1.2.3' },
      expectedUpdatedAt: created.updatedAt,
    });
    expect(updated.profile.name).toBe('Lab optical v2');
    expect(updated.profile.limits).toEqual({ maxRateHz: { hard: 60 } });
    expect(updated.updatedByEmail).toBe(a.people.admin!.email);

    // A save made from the old copy is refused rather than silently overwriting the newer one.
    const stale = await refusal(
      updateLimitProfile({ labId: a.lab.id, id: created.id, input: opticalProfile(), actor: officer, expectedUpdatedAt: created.updatedAt }),
    );
    expect(stale.status).toBe(409);

    await deleteLimitProfile({ labId: a.lab.id, id: created.id, actor: officer });
    expect(await listLimitProfiles({ labId: a.lab.id })).toEqual([]);

    const audit = await db.select().from(auditLog).where(eq(auditLog.labId, a.lab.id)).orderBy(auditLog.id);
    expect(audit.map((r) => r.action)).toEqual(['limits.created', 'limits.updated', 'limits.deleted']);
    expect(audit.every((r) => r.subjectType === 'limit_profile' && r.subjectId === created.id)).toBe(true);
    expect(audit[1]!.actorLabel).toBe(a.people.admin!.email);
    expect(audit[1]!.ip).toBe('10.1.2.3');
    const details = audit[1]!.details as { changes: string[]; before: { name: string }; after: { name: string } };
    expect(details.before.name).toBe('Lab optical');
    expect(details.changes).toEqual([
      'limits.maxIrradianceMwPerMm2: {"hard":1000,"warn":400} → (not set)',
      'limits.maxRateHz.hard: 100 → 60',
      'limits.maxRateHz.warn: 40 → (not set)',
      'name: "Lab optical" → "Lab optical v2"',
      'whenUnknown: "fail" → (not set)',
    ]);
    expect(await db.select().from(auditLog).where(eq(auditLog.labId, b.lab.id))).toEqual([]);
  });

  it('rejects invalid limits with the field path and writes nothing', async () => {
    const { lab, people } = await makeLab();
    const bad = await refusal(
      createLimitProfile({
        labId: lab.id,
        input: { name: ' ', modality: 'optical', limits: { maxRateHz: { warn: 120, hard: 100 }, maxPeakPowerMw: { hard: -1 } } },
        actor: actorOf(people.officer!),
      }),
    );
    expect(bad.status).toBe(400);
    const paths = bad.issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['name', 'limits.maxRateHz.warn', 'limits.maxPeakPowerMw.hard']));
    expect(bad.issues.find((i) => i.path === 'limits.maxRateHz.warn')?.message).toMatch(/warning level must not be above/);

    // Strings are not numbers: the form must send numbers, and the server does not coerce.
    const strings = await refusal(
      createLimitProfile({ labId: lab.id, input: { name: 'x', modality: 'electrical', limits: { maxShannonK: { hard: '1.75' } } }, actor: actorOf(people.officer!) }),
    );
    expect(strings.issues.map((i) => i.path)).toContain('limits.maxShannonK.hard');
    expect(await db.select().from(limitProfiles).where(eq(limitProfiles.labId, lab.id))).toEqual([]);
    expect(await db.select().from(auditLog).where(eq(auditLog.labId, lab.id))).toEqual([]);
  });

  it('refuses a rig from another lab or of the other modality, and a second profile for the same scope', async () => {
    const a = await makeLab();
    const b = await makeLab();
    const actor = actorOf(a.people.officer!);
    const foreignRig = await makeRig(b.lab.id);
    const electricalRig = await makeRig(a.lab.id, { modality: 'electrical', fibreCoreUm: null, electrodeAreaMm2: 0.05 });
    const foreign = await refusal(createLimitProfile({ labId: a.lab.id, input: opticalProfile({ rigId: foreignRig.id }), actor }));
    expect(foreign.issues[0]?.path).toBe('rigId');
    const mismatch = await refusal(createLimitProfile({ labId: a.lab.id, input: opticalProfile({ rigId: electricalRig.id }), actor }));
    expect(mismatch.issues[0]?.path).toBe('rigId');

    await createLimitProfile({ labId: a.lab.id, input: opticalProfile(), actor });
    expect((await refusal(createLimitProfile({ labId: a.lab.id, input: opticalProfile({ name: 'Another' }), actor }))).status).toBe(409);
    // The same scope in another lab is that lab's business.
    await createLimitProfile({ labId: b.lab.id, input: opticalProfile(), actor: actorOf(b.people.officer!) });
  });

  it('profileFor picks the rig’s own profile over the lab’s, and the lab’s for other rigs', async () => {
    const { lab, people } = await makeLab();
    const actor = actorOf(people.officer!);
    const rig1 = await makeRig(lab.id);
    const rig2 = await makeRig(lab.id);
    expect(await profileFor({ labId: lab.id, modality: 'optical', rigId: rig1.id })).toBeNull();

    const labWide = await createLimitProfile({ labId: lab.id, input: opticalProfile(), actor });
    const own = await createLimitProfile({ labId: lab.id, input: opticalProfile({ name: 'Rig 1 only', rigId: rig1.id }), actor });
    expect((await profileFor({ labId: lab.id, modality: 'optical', rigId: rig1.id }))?.id).toBe(own.id);
    expect((await profileFor({ labId: lab.id, modality: 'optical', rigId: rig2.id }))?.id).toBe(labWide.id);
    expect((await profileFor({ labId: lab.id, modality: 'optical', rigId: null }))?.id).toBe(labWide.id);
    expect(await profileFor({ labId: lab.id, modality: 'electrical', rigId: rig1.id })).toBeNull();
  });

  it('re-parses what it reads: a row edited by hand into nonsense is refused, not used', async () => {
    const { lab, people } = await makeLab();
    const p = await createLimitProfile({ labId: lab.id, input: opticalProfile(), actor: actorOf(people.officer!) });
    await db
      .update(limitProfiles)
      .set({ limits: { maxRateHz: { hard: 'lots' } } })
      .where(and(eq(limitProfiles.labId, lab.id), eq(limitProfiles.id, p.id)));
    await expect(profileFor({ labId: lab.id, modality: 'optical' })).rejects.toThrow(/limits\.maxRateHz\.hard/);
  });
});

describe('computeSafetySheet', () => {
  it('computes irradiance from the rig’s fibre core: 10 mW through 200 µm is 318.3 mW/mm²', async () => {
    // E = P / (π r²) = 10 / (π · 0.1²) = 318.31 mW/mm² (facts.md §5, (c)).
    const { lab, people } = await makeLab();
    const rig = await makeRig(lab.id, { fibreCoreUm: 200, clockHz: 20_000 });
    await createLimitProfile({ labId: lab.id, input: opticalProfile(), actor: actorOf(people.officer!) });
    const spec = { ...optical, trials: 2, pulse: { ...optical.pulse, amplitude: 10 } };
    const sheet = await computeSafetySheet({ labId: lab.id, spec, rigId: rig.id });
    const row = sheet.rows.find((r) => r.id === 'irradiance')!;
    expect(row.value).toBeCloseTo(318.31, 2);
    expect(row.unit).toBe('mW/mm²');
    expect(row.limit).toEqual({ warn: 400, hard: 1000 });
    expect(row.margin).toBeCloseTo(1000 - 318.31, 2);
    expect(row.status).toBe('pass');
    expect(sheet.profile).toMatchObject({ scope: 'lab', name: 'Lab optical' });
    expect(sheet.schedule.measured).toBe(true);
    expect(sheet.canSubmit).toBe(true);

    // A 100 µm core concentrates the same light fourfold: 1273 mW/mm², over the hard limit.
    const thin = await makeRig(lab.id, { fibreCoreUm: 100, clockHz: 20_000 });
    const blocked = await computeSafetySheet({ labId: lab.id, spec, rigId: thin.id });
    expect(blocked.rows.find((r) => r.id === 'irradiance')!.value).toBeCloseTo(1273.2, 1);
    expect(blocked.rows.find((r) => r.id === 'irradiance')!.status).toBe('fail');
    expect(blocked.canSubmit).toBe(false);
  });

  it('uses the demo defaults and says so when the lab has no profile for the modality', async () => {
    const { lab } = await makeLab();
    const rig = await makeRig(lab.id, { modality: 'electrical', fibreCoreUm: null, electrodeAreaMm2: 0.0314, clockHz: 30_000 });
    const sheet = await computeSafetySheet({ labId: lab.id, spec: { ...electrical, trials: 1 }, rigId: rig.id });
    expect(sheet.profile).toEqual({ id: null, name: demoProfileFor('electrical').name, scope: 'demo', rigName: null });
    // Q = 60 µA × 200 µs = 12 nC (facts §4 (c)); the demo warning level is 30 nC.
    expect(sheet.rows.find((r) => r.id === 'charge-per-phase')?.value).toBeCloseTo(12, 9);
    expect(sheet.rows.find((r) => r.id === 'window-pulses')?.value).toBe(sheet.schedule.worstWindowPulses);
  });

  it('refuses a rig of another lab and an invalid spec with 4xx errors', async () => {
    const a = await makeLab();
    const b = await makeLab();
    const foreign = await makeRig(b.lab.id);
    expect((await refusal(computeSafetySheet({ labId: a.lab.id, spec: optical, rigId: foreign.id }))).status).toBe(404);
    const bad = await refusal(computeSafetySheet({ labId: a.lab.id, spec: { ...optical, trials: 0 }, rigId: null }));
    expect(bad.status).toBe(400);
    expect(bad.issues.map((i) => i.path)).toContain('trials');
  });
});
