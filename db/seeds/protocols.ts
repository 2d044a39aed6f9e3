// Demo protocols of the Harbor Lane Circuits Lab: an optical one with an approved v1 and a
// draft v2 on Bench 2, and an electrical one waiting for review on Bench 5. Idempotent: a
// protocol that already exists (by lab and name) is left as it is.
import { and, eq } from 'drizzle-orm';
import * as schema from '../schema';
import { canonicalSpec, parseSpec, scanSchedule, type Spec } from '../../lib/schedule';
import optical from '../../lib/schedule/examples/optical-ramp-sine.json';
import electrical from '../../lib/schedule/examples/electrical-biphasic.json';
import type { SeedContext, SeedPart } from './index';

const LAB = 'harbor-lane';
const AUTHOR = 'ada.quill@harborlane.test';
const OFFICER = 'tomas.reyes@harborlane.test';
const DAY = 86_400_000;

function specFor(raw: unknown, clockHz: number, over: Partial<Spec> = {}): Spec {
  const r = parseSpec({ ...(raw as object), ...over, clockHz });
  if (!r.ok) throw new Error(`demo spec invalid: ${r.errors.map((e) => `${e.path} ${e.message}`).join('; ')}`);
  return canonicalSpec(r.spec);
}

async function existing(ctx: SeedContext, labId: string, name: string) {
  const [row] = await ctx.tx
    .select({ id: schema.protocols.id })
    .from(schema.protocols)
    .where(and(eq(schema.protocols.labId, labId), eq(schema.protocols.name, name)))
    .limit(1);
  return row ?? null;
}

/** Audit rows dated when the demo says things happened (the log is append-only; inserting is allowed). */
async function audit(ctx: SeedContext, labId: string, who: string, action: string, subjectId: string, at: Date, extra: { checksum?: string; details?: Record<string, unknown> } = {}) {
  await ctx.tx.insert(schema.auditLog).values({
    labId,
    at,
    actorUserId: ctx.userIds[who] ?? null,
    actorLabel: who,
    action,
    subjectType: 'protocol_version',
    subjectId,
    checksum: extra.checksum ?? null,
    ip: 'seed',
    details: { ...extra.details, demo: true },
  });
}

/** A protocol of the lab on one rig; returns its id and the rig's. */
async function createProtocol(
  ctx: SeedContext,
  labId: string,
  p: { name: string; purpose: string; modality: 'optical' | 'electrical'; target: string; rigName: string },
) {
  const rigId = ctx.rigIds[p.rigName]!;
  const [protocol] = await ctx.tx
    .insert(schema.protocols)
    .values({ labId, name: p.name, purpose: p.purpose, modality: p.modality, target: p.target, createdBy: ctx.userIds[AUTHOR]! })
    .returning({ id: schema.protocols.id });
  await ctx.tx.insert(schema.protocolRigs).values({ labId, protocolId: protocol!.id, rigId });
  return { protocolId: protocol!.id, rigId };
}

async function thetaLight(ctx: SeedContext, labId: string) {
  const name = 'Theta-paced light, dorsal CA1';
  if (await existing(ctx, labId, name)) return;
  const rigName = 'Bench 2 — blue light';
  const author = ctx.userIds[AUTHOR]!;
  const officer = ctx.userIds[OFFICER]!;
  const { protocolId, rigId } = await createProtocol(ctx, labId, {
    name,
    purpose: 'Drive CA1 pyramidal cells at theta-band rates with random timing during the linear-track task, cohort B.',
    modality: 'optical',
    target: 'dorsal CA1, left hemisphere',
    rigName,
  });

  const v1Spec = specFor(optical, 10_000);
  const { checksum, pulseCount } = scanSchedule(v1Spec);
  const submittedAt = new Date(Date.now() - 6 * DAY);
  const decidedAt = new Date(Date.now() - 5 * DAY);
  const [v1] = await ctx.tx
    .insert(schema.protocolVersions)
    .values({
      labId,
      protocolId,
      number: 1,
      status: 'approved',
      spec: v1Spec,
      rigId,
      checksum,
      pulseCount,
      justification: 'Sessions run three minutes per trial to cover the whole track lap; the mean power stays far below the limit.',
      authorId: author,
      submittedAt,
      decidedBy: officer,
      decidedAt,
      approvedChecksum: checksum,
      revision: 3,
      createdAt: new Date(Date.now() - 8 * DAY),
    })
    .returning({ id: schema.protocolVersions.id });
  await ctx.tx.insert(schema.reviewComments).values({
    labId,
    versionId: v1!.id,
    authorId: officer,
    decision: 'approve',
    body: 'Fine for the cohort B sessions. Log fibre output before each day.',
    createdAt: decidedAt,
  });
  await audit(ctx, labId, AUTHOR, 'version.created', v1!.id, new Date(Date.now() - 8 * DAY), { details: { number: 1 } });
  await audit(ctx, labId, AUTHOR, 'version.submitted', v1!.id, submittedAt, { checksum, details: { protocol: name, number: 1, rig: rigName } });
  await audit(ctx, labId, OFFICER, 'version.approved', v1!.id, decidedAt, { checksum, details: { protocol: name, number: 1, rig: rigName } });

  // v2: the same schedule with a gentler last section, still being edited.
  const v2Spec = specFor(optical, 10_000, {
    envelope: [
      { kind: 'ramp', durationS: 30, fromHz: 2, toHz: 12 },
      { kind: 'ramp', durationS: 60, fromHz: 12, toHz: 12 },
      { kind: 'sine', durationS: 90, meanHz: 8, depthHz: 6, freqHz: 0.25, phaseDeg: -90 },
    ],
  });
  const [v2] = await ctx.tx
    .insert(schema.protocolVersions)
    .values({ labId, protocolId, number: 2, status: 'draft', spec: v2Spec, rigId, authorId: author, copiedFromId: v1!.id, revision: 1 })
    .returning({ id: schema.protocolVersions.id });
  await audit(ctx, labId, AUTHOR, 'version.copied', v2!.id, new Date(Date.now() - 2 * DAY), { details: { number: 2, from: 1 } });
}

async function hvcMicrostim(ctx: SeedContext, labId: string) {
  const name = 'Random-timing microstimulation, HVC';
  if (await existing(ctx, labId, name)) return;
  const rigName = 'Bench 5 — microstim';
  const author = ctx.userIds[AUTHOR]!;
  const { protocolId, rigId } = await createProtocol(ctx, labId, {
    name,
    purpose: 'Test whether randomly timed biphasic pulses in HVC perturb song timing more than periodic trains.',
    modality: 'electrical',
    target: 'HVC, right hemisphere',
    rigName,
  });
  const spec = specFor(electrical, 30_000);
  const { checksum, pulseCount } = scanSchedule(spec);
  const submittedAt = new Date(Date.now() - 1 * DAY);
  const [v1] = await ctx.tx
    .insert(schema.protocolVersions)
    .values({
      labId,
      protocolId,
      number: 1,
      status: 'in_review',
      spec,
      rigId,
      checksum,
      pulseCount,
      justification: 'Three-minute trains match one song bout session; charge density is at the warning level only on the smallest electrode.',
      authorId: author,
      submittedAt,
      revision: 2,
      createdAt: new Date(Date.now() - 3 * DAY),
    })
    .returning({ id: schema.protocolVersions.id });
  await audit(ctx, labId, AUTHOR, 'version.created', v1!.id, new Date(Date.now() - 3 * DAY), { details: { number: 1 } });
  await audit(ctx, labId, AUTHOR, 'version.submitted', v1!.id, submittedAt, { checksum, details: { protocol: name, number: 1, rig: rigName } });
}

export const seedProtocols: SeedPart = async (ctx) => {
  const labId = ctx.labIds[LAB]!;
  await thetaLight(ctx, labId);
  await hvcMicrostim(ctx, labId);
};
