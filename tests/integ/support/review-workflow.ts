import { and, eq } from 'drizzle-orm';
import { db } from '@/db/client';
import { auditLog, outbox, protocolVersions } from '@/db/schema';
import type { Role } from '@/lib/auth/roles';
import type { Member } from '@/lib/auth/session';
import type { Spec } from '@/lib/schedule';
import { createProtocol, saveDraftSpec, type RequestContext } from '@/lib/versions/workflow';
import { makeLab, makeRig } from './fixtures';

export const CTX: RequestContext = { ip: '203.0.113.7', appUrl: 'http://pulseloom.test' };

/**
 * Checked against the lab's demo optical limits (lib/safety/demo-profiles.ts, no stored
 * profile): 30 s train, ≤ 12 Hz, 6.5 mW through 200 µm — every row passes or is info.
 */
export const CLEAN_SPEC: Spec = {
  format: 'pulseloom-spec/1',
  envelope: [{ kind: 'ramp', durationS: 30, fromHz: 2, toHz: 12 }],
  ceilingHz: 25,
  refractory: { absoluteMs: 10, recoveryMs: 0 },
  caps: { maxRateHz: 40 },
  pulse: { widthMs: 8, amplitude: 6.5, unit: 'mW' },
  trials: 4,
  seed: 'integ-clean',
  clockHz: 10_000,
};

/** 25 mW peak: over the demo profile's 20 mW warning level, under its 30 mW hard limit. */
export const WARN_SPEC: Spec = { ...CLEAN_SPEC, pulse: { ...CLEAN_SPEC.pulse, amplitude: 25 } };
/** 45 mW peak: over the demo profile's 30 mW hard limit. */
export const FAIL_SPEC: Spec = { ...CLEAN_SPEC, pulse: { ...CLEAN_SPEC.pulse, amplitude: 45 } };

const ROLES = {
  author: ['experimenter'],
  colleague: ['experimenter'],
  officer: ['safety_officer'],
  officer2: ['safety_officer'],
  admin: ['lab_admin'],
  both: ['experimenter', 'safety_officer'],
} satisfies Record<string, Role[]>;

export type Actors = Record<keyof typeof ROLES, Member>;

/** A lab with one member per role (and one with both), an optical rig with full data, and a second rig. */
export async function makeReviewLab() {
  const { lab, people } = await makeLab(ROLES);
  const rig = await makeRig(lab.id, { modality: 'optical', clockHz: 10_000, wavelengthNm: 473, fibreCoreUm: 200, fibreNA: 0.39 });
  const rig2 = await makeRig(lab.id, { modality: 'optical', clockHz: 20_000, wavelengthNm: 473, fibreCoreUm: 200, fibreNA: 0.39 });
  const as = {} as Actors;
  for (const [key, roles] of Object.entries(ROLES) as [keyof Actors, Role[]][]) {
    const p = people[key]!;
    as[key] = { user: { id: p.id, email: p.email, name: key }, lab: { id: lab.id, name: lab.name, slug: lab.slug }, roles, labs: [] };
  }
  return { lab, rig, rig2, as };
}

/** A protocol with a draft v1 holding `spec`, written by `author`. */
export async function makeDraft(t: Awaited<ReturnType<typeof makeReviewLab>>, spec: Spec = CLEAN_SPEC, author: Member = t.as.author) {
  const created = await createProtocol(
    author,
    { name: `P ${Math.random().toString(36).slice(2, 8)}`, purpose: 'test', modality: 'optical', target: 'CA1, left', rigIds: [t.rig.id, t.rig2.id], startFrom: 'example' },
    CTX,
  );
  await saveDraftSpec(author, { versionId: created.versionId, spec }, CTX);
  return created;
}

export async function versionRow(id: string) {
  const [row] = await db.select().from(protocolVersions).where(eq(protocolVersions.id, id));
  return row!;
}

export async function auditFor(subjectId: string) {
  return db.select().from(auditLog).where(eq(auditLog.subjectId, subjectId)).orderBy(auditLog.id);
}

export async function outboxFor(labId: string, to?: string) {
  return db
    .select()
    .from(outbox)
    .where(to ? and(eq(outbox.labId, labId), eq(outbox.to, to)) : eq(outbox.labId, labId))
    .orderBy(outbox.createdAt);
}

/** The HTTP status an AppError carries, or 'ok'. */
export async function outcome(p: Promise<unknown>): Promise<'ok' | number> {
  try {
    await p;
    return 'ok';
  } catch (e) {
    const status = (e as { status?: number }).status;
    if (typeof status === 'number') return status;
    throw e;
  }
}
