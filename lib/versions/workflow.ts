import 'server-only';
/**
 * Server-side changes of protocols and versions. Each function takes the signed-in member,
 * checks the role and state with the pure machine, and does its writes, the audit row and
 * any e-mail (outbox) in one transaction. Actions call these and deliver mail after commit.
 */
import { db } from '@/db/client';
import { recordAudit } from '@/db/queries/audit';
import {
  getEnvelopeSpec,
  getProtocol,
  insertProtocol,
  listProtocolRigs,
  liveRigsByIds,
  lockProtocol,
  touchProtocol,
  type Tx,
} from '@/db/queries/protocols';
import {
  contributorsOf,
  getVersion,
  insertComment,
  insertVersion,
  nextVersionNumber,
  safetyOfficersOf,
  submitterOf,
  transitionVersion,
  updateDraft,
  type VersionRow,
} from '@/db/queries/versions';
import { may, type Permission } from '@/lib/auth/roles';
import type { Member } from '@/lib/auth/session';
import { AppError, badRequest, conflict, forbiddenError, notFound } from '@/lib/http/errors';
import { enqueueMail } from '@/lib/mail/outbox';
import { decisionMessage, submittedMessage, withdrawnMessage } from '@/lib/mail/review-messages';
import { computeSafetySheet } from '@/lib/review/sheet';
import { canonicalSpec, modalityOf, parseSpec, scanSchedule, type Spec } from '@/lib/schedule';
import { diffValues } from './diff';
import { exampleSpecFor } from './examples';
import { checkAction, type VersionAction } from './machine';
import type { DecisionInput, ProtocolFormInput, SubmitInput } from './schemas';

export const CONFLICT_MESSAGE = 'Someone else acted on this version first; reload to see its state.';

/** Where the request came from and where links in e-mails point. */
export type RequestContext = { ip: string | null; appUrl: string };

const actorOf = (m: Member) => ({ userId: m.user.id, label: m.user.email });
const displayName = (p: { name: string | null; email: string | null }) => p.name ?? p.email ?? 'someone';

function requirePermission(member: Member, permission: Permission) {
  if (!member.lab.id || !may(member.roles, permission)) throw forbiddenError();
}

function versionUrl(ctx: RequestContext, v: { protocolId: string; number: number }) {
  return `${ctx.appUrl.replace(/\/$/, '')}/protocols/${v.protocolId}/versions/${v.number}`;
}

function reviewUrl(ctx: RequestContext, versionId: string) {
  return `${ctx.appUrl.replace(/\/$/, '')}/reviews/${versionId}`;
}

async function loadVersion(member: Member, versionId: string, revision?: number): Promise<VersionRow> {
  const v = await getVersion({ labId: member.lab.id, versionId });
  if (!v) throw notFound('That version is not in this lab.');
  // A page older than the row: whatever it offered may no longer apply.
  if (revision !== undefined && revision !== v.revision) throw conflict(CONFLICT_MESSAGE);
  return v;
}

/** Runs the machine with this member's roles and their part in the version; throws on refusal. */
async function authorize(member: Member, v: VersionRow, action: VersionAction) {
  const contributors = await contributorsOf({ labId: member.lab.id, versionId: v.id, authorId: v.authorId });
  const verdict = checkAction(action, v.status, { roles: member.roles, contributed: contributors.has(member.user.id) });
  if (!verdict.ok) {
    if (verdict.reason === 'state') throw conflict(verdict.message);
    throw forbiddenError(verdict.message);
  }
  return verdict.to;
}

function specOrThrow(input: unknown): Spec {
  const parsed = parseSpec(input);
  if (!parsed.ok) throw badRequest('The spec is not valid.', parsed.errors.map((e) => ({ path: `spec.${e.path}`.replace(/\.\$$/, ''), message: e.message })));
  return parsed.spec;
}

/** The clock always comes from the rig: a schedule placed on another clock would be another schedule. */
function onRigClock(spec: unknown, clockHz: number | null): unknown {
  if (clockHz === null || typeof spec !== 'object' || spec === null || Array.isArray(spec)) return spec;
  return { ...(spec as Record<string, unknown>), clockHz };
}

// ── protocols ────────────────────────────────────────────────────────────────────────────

export async function createProtocol(member: Member, input: ProtocolFormInput, ctx: RequestContext) {
  requirePermission(member, 'protocols.edit');
  const labId = member.lab.id;
  const rigIds = [...new Set(input.rigIds)];
  const rigs = await liveRigsByIds({ labId, rigIds });
  if (rigs.length !== rigIds.length) throw badRequest('Some rigs are not in this lab.', [{ path: 'rigIds', message: 'Choose rigs of this lab' }]);
  const wrong = rigs.filter((r) => r.modality !== input.modality);
  if (wrong.length > 0) {
    throw badRequest('A rig of another modality was chosen.', [
      { path: 'rigIds', message: `${wrong.map((r) => r.name).join(', ')} ${wrong.length === 1 ? 'is' : 'are'} not ${input.modality}` },
    ]);
  }
  // The first chosen rig carries the first version; its clock goes into the spec.
  const first = rigs.find((r) => r.id === rigIds[0])!;
  let start: unknown;
  if (input.startFrom === 'example') {
    start = exampleSpecFor(input.modality);
  } else {
    const env = await getEnvelopeSpec({ labId, envelopeId: input.startFrom });
    if (!env) throw badRequest('That envelope is not in this lab.', [{ path: 'startFrom', message: 'Choose an envelope of this lab' }]);
    if (env.modality !== input.modality) throw badRequest('That envelope is for the other modality.', [{ path: 'startFrom', message: `Choose an ${input.modality} envelope` }]);
    start = env.spec;
  }
  const spec = onRigClock(start, first.clockHz);

  return db.transaction(async (tx) => {
    const protocolId = await insertProtocol(tx, {
      labId,
      name: input.name,
      purpose: input.purpose,
      modality: input.modality,
      target: input.target,
      createdBy: member.user.id,
      rigIds,
    });
    const version = await insertVersion(tx, { labId, protocolId, number: 1, spec, rigId: first.id, authorId: member.user.id });
    await recordAudit(tx, {
      labId,
      actor: actorOf(member),
      action: 'protocol.created',
      subjectType: 'protocol',
      subjectId: protocolId,
      ip: ctx.ip,
      details: { name: input.name, modality: input.modality, rigs: rigs.map((r) => r.name) },
    });
    await recordAudit(tx, {
      labId,
      actor: actorOf(member),
      action: 'version.created',
      subjectType: 'protocol_version',
      subjectId: version.id,
      ip: ctx.ip,
      details: { protocolId, number: 1, startFrom: input.startFrom },
    });
    return { protocolId, versionId: version.id, number: 1 };
  });
}

// ── drafts ───────────────────────────────────────────────────────────────────────────────

/** Saves a draft's spec (clock taken from its rig). Returns the new revision. */
export async function saveDraftSpec(member: Member, input: { versionId: string; spec: unknown }, ctx: RequestContext) {
  requirePermission(member, 'protocols.edit');
  const v = await loadVersion(member, input.versionId);
  await authorize(member, v, 'edit');
  const spec = canonicalSpec(specOrThrow(input.spec));
  // The clock is the rig's, set when the rig is chosen; a typed one would make another schedule.
  if (v.rigClockHz !== null && spec.clockHz !== v.rigClockHz) {
    throw badRequest(`The clock comes from the rig: ${v.rigName} runs at ${v.rigClockHz} Hz.`, [
      { path: 'spec.clockHz', message: `must be ${v.rigClockHz} Hz, ${v.rigName}’s clock; choose another rig to change it` },
    ]);
  }
  if (modalityOf(spec) !== v.modality) {
    throw badRequest(`This protocol is ${v.modality}.`, [{ path: 'spec.pulse.unit', message: `use ${v.modality === 'optical' ? 'mW' : 'uA'} for an ${v.modality} protocol` }]);
  }
  const changed = diffValues(v.spec, spec).map((r) => r.path);
  return db.transaction(async (tx) => {
    const row = await updateDraft(tx, { labId: v.labId, versionId: v.id, set: { spec } });
    if (!row) throw conflict('This version was submitted meanwhile and is frozen; reload to see its state.');
    await touchProtocol(tx, { labId: v.labId, protocolId: v.protocolId });
    await recordAudit(tx, {
      labId: v.labId,
      actor: actorOf(member),
      action: 'version.saved',
      subjectType: 'protocol_version',
      subjectId: v.id,
      ip: ctx.ip,
      details: { number: v.number, changed: changed.slice(0, 40), changedCount: changed.length },
    });
    return { revision: row.revision };
  });
}

/** Points a draft at another of the protocol's rigs; the spec takes that rig's clock. */
export async function setDraftRig(member: Member, input: { versionId: string; rigId: string }, ctx: RequestContext) {
  requirePermission(member, 'protocols.edit');
  const v = await loadVersion(member, input.versionId);
  await authorize(member, v, 'edit');
  const rig = (await listProtocolRigs({ labId: v.labId, protocolId: v.protocolId })).find((r) => r.id === input.rigId && !r.archivedAt);
  if (!rig) throw badRequest('That rig is not one this protocol may run on.', [{ path: 'rigId', message: 'Choose one of the protocol’s rigs' }]);
  const spec = onRigClock(v.spec, rig.clockHz);
  return db.transaction(async (tx) => {
    const row = await updateDraft(tx, { labId: v.labId, versionId: v.id, set: { rigId: rig.id, spec } });
    if (!row) throw conflict('This version was submitted meanwhile and is frozen; reload to see its state.');
    await recordAudit(tx, {
      labId: v.labId,
      actor: actorOf(member),
      action: 'version.rig_set',
      subjectType: 'protocol_version',
      subjectId: v.id,
      ip: ctx.ip,
      details: { number: v.number, rig: rig.name, clockHz: rig.clockHz, previousRig: v.rigName },
    });
    return { revision: row.revision };
  });
}

// ── submission ───────────────────────────────────────────────────────────────────────────

export async function submitVersion(member: Member, input: SubmitInput, ctx: RequestContext) {
  requirePermission(member, 'protocols.submit');
  const v = await loadVersion(member, input.versionId, input.revision);
  await authorize(member, v, 'submit');
  if (!v.rigId || v.rigClockHz === null) throw badRequest('Choose the rig this version runs on first.', [{ path: 'rigId', message: 'Choose a rig' }]);
  if (v.rigArchivedAt) throw badRequest(`${v.rigName} is archived.`, [{ path: 'rigId', message: 'Choose a rig in use' }]);
  const allowed = await listProtocolRigs({ labId: v.labId, protocolId: v.protocolId });
  if (!allowed.some((r) => r.id === v.rigId)) throw badRequest(`${v.rigName} is no longer one of this protocol’s rigs.`, [{ path: 'rigId', message: 'Choose one of the protocol’s rigs' }]);
  const spec = specOrThrow(v.spec);
  if (spec.clockHz !== v.rigClockHz) {
    throw badRequest(`The spec’s clock (${spec.clockHz} Hz) is not ${v.rigName}’s (${v.rigClockHz} Hz). Save the draft again to take the rig’s clock.`, [
      { path: 'spec.clockHz', message: `must be ${v.rigClockHz} Hz, the rig’s clock` },
    ]);
  }
  if (modalityOf(spec) !== v.modality) throw badRequest(`This protocol is ${v.modality}.`, [{ path: 'spec.pulse.unit', message: `not ${v.modality}` }]);

  const sheet = await computeSafetySheet({ labId: v.labId, spec, rigId: v.rigId });
  if (!sheet.canSubmit) {
    const failing = sheet.rows.filter((r) => r.status === 'fail');
    throw new AppError(
      422,
      'limits_failed',
      `This version fails ${failing.length === 1 ? 'a hard limit' : `${failing.length} hard limits`} and cannot be submitted.`,
      failing.map((r) => ({ path: `safety.${r.id}`, message: `${r.label}: ${r.help}` })),
    );
  }
  const justification = input.justification.trim();
  if (sheet.needsJustification && justification.length === 0) {
    throw badRequest('Some values are at warning level: explain in writing why they are needed.', [
      { path: 'justification', message: 'Write why the warning-level values are needed' },
    ]);
  }
  const { checksum, pulseCount } = scanSchedule(spec);
  const warnings = sheet.rows.filter((r) => r.status === 'warn').map((r) => r.id);

  return db.transaction(async (tx) => {
    const row = await transitionVersion(tx, {
      labId: v.labId,
      versionId: v.id,
      revision: input.revision,
      from: 'draft',
      set: { status: 'in_review', checksum, pulseCount, justification: justification || null, submittedAt: new Date() },
    });
    if (!row) throw conflict(CONFLICT_MESSAGE);
    await touchProtocol(tx, { labId: v.labId, protocolId: v.protocolId });
    await recordAudit(tx, {
      labId: v.labId,
      actor: actorOf(member),
      action: 'version.submitted',
      subjectType: 'protocol_version',
      subjectId: v.id,
      checksum,
      ip: ctx.ip,
      details: { protocol: v.protocolName, number: v.number, rig: v.rigName, warnings, justified: Boolean(justification) },
    });
    // Contributors cannot decide this version, so the request goes to the other officers.
    const contributors = await contributorsOf({ labId: v.labId, versionId: v.id, authorId: v.authorId }, tx);
    contributors.add(member.user.id);
    const officers = (await safetyOfficersOf({ labId: v.labId }, tx)).filter((o) => !contributors.has(o.id) && o.email);
    const message = submittedMessage({
      protocolName: v.protocolName,
      number: v.number,
      labName: member.lab.name,
      submitter: displayName(member.user),
      rigName: v.rigName ?? 'its rig',
      justification: justification || null,
      url: reviewUrl(ctx, v.id),
    });
    for (const o of officers) await enqueueMail(tx, v.labId, o.email!, message);
    return { revision: row.revision, checksum, notified: officers.length };
  });
}

// ── review ───────────────────────────────────────────────────────────────────────────────

export async function decideVersion(member: Member, input: DecisionInput, ctx: RequestContext) {
  requirePermission(member, 'reviews.decide');
  const v = await loadVersion(member, input.versionId, input.revision);
  const to = await authorize(member, v, input.decision);
  let checksum: string | null = null;
  let pulseCount: number | null = null;
  if (input.decision === 'approve') {
    // What is approved must be what was submitted and what the rig will get: the schedule
    // is regenerated and its checksum compared, and the rig's clock checked again.
    const spec = specOrThrow(v.spec);
    if (v.rigClockHz !== spec.clockHz) {
      throw conflict(`${v.rigName ?? 'The rig'} now runs at ${v.rigClockHz} Hz, not the ${spec.clockHz} Hz this version was made for. Return it so that it is made again for the rig.`);
    }
    ({ checksum, pulseCount } = scanSchedule(spec));
    if (checksum !== v.checksum) {
      throw conflict('The engine now generates a different schedule for this spec than the one submitted. Return the version so that it is submitted again.');
    }
  }
  const now = new Date();
  return db.transaction(async (tx: Tx) => {
    const row = await transitionVersion(tx, {
      labId: v.labId,
      versionId: v.id,
      revision: input.revision,
      from: 'in_review',
      set: { status: to, decidedBy: member.user.id, decidedAt: now, ...(checksum ? { approvedChecksum: checksum, pulseCount } : {}) },
    });
    if (!row) throw conflict(CONFLICT_MESSAGE);
    await insertComment(tx, { labId: v.labId, versionId: v.id, authorId: member.user.id, decision: input.decision, body: input.comment });
    await touchProtocol(tx, { labId: v.labId, protocolId: v.protocolId });
    await recordAudit(tx, {
      labId: v.labId,
      actor: actorOf(member),
      action: input.decision === 'approve' ? 'version.approved' : 'version.returned',
      subjectType: 'protocol_version',
      subjectId: v.id,
      checksum: checksum ?? v.checksum,
      ip: ctx.ip,
      details: { protocol: v.protocolName, number: v.number, rig: v.rigName, comment: input.comment || null },
    });
    const message = decisionMessage({
      protocolName: v.protocolName,
      number: v.number,
      labName: member.lab.name,
      decision: input.decision,
      officer: displayName(member.user),
      comment: input.comment,
      checksum,
      url: versionUrl(ctx, v),
    });
    const recipients = new Set<string>();
    if (v.authorEmail) recipients.add(v.authorEmail);
    const submitter = await submitterOf({ labId: v.labId, versionId: v.id }, tx);
    if (submitter?.email) recipients.add(submitter.email);
    for (const to of recipients) await enqueueMail(tx, v.labId, to, message);
    return { status: row.status, revision: row.revision, checksum };
  });
}

export async function withdrawVersion(member: Member, input: { versionId: string; revision: number; reason: string }, ctx: RequestContext) {
  requirePermission(member, 'protocols.view');
  const v = await loadVersion(member, input.versionId, input.revision);
  await authorize(member, v, 'withdraw');
  return db.transaction(async (tx) => {
    const row = await transitionVersion(tx, { labId: v.labId, versionId: v.id, revision: input.revision, from: v.status, set: { status: 'withdrawn' } });
    if (!row) throw conflict(CONFLICT_MESSAGE);
    await insertComment(tx, { labId: v.labId, versionId: v.id, authorId: member.user.id, decision: 'withdraw', body: input.reason });
    await touchProtocol(tx, { labId: v.labId, protocolId: v.protocolId });
    await recordAudit(tx, {
      labId: v.labId,
      actor: actorOf(member),
      action: 'version.withdrawn',
      subjectType: 'protocol_version',
      subjectId: v.id,
      checksum: v.approvedChecksum ?? v.checksum,
      ip: ctx.ip,
      details: { protocol: v.protocolName, number: v.number, from: v.status, reason: input.reason },
    });
    if (v.status === 'approved' && v.authorEmail && v.authorId !== member.user.id) {
      await enqueueMail(
        tx,
        v.labId,
        v.authorEmail,
        withdrawnMessage({ protocolName: v.protocolName, number: v.number, labName: member.lab.name, officer: displayName(member.user), reason: input.reason, url: versionUrl(ctx, v) }),
      );
    }
    return { revision: row.revision };
  });
}

/** A new draft (number n+1) with the spec and rig of this version, which stays as it is. */
export async function copyVersion(member: Member, input: { versionId: string }, ctx: RequestContext) {
  requirePermission(member, 'protocols.edit');
  const v = await loadVersion(member, input.versionId);
  await authorize(member, v, 'copy');
  const protocol = await getProtocol({ labId: v.labId, protocolId: v.protocolId });
  if (!protocol) throw notFound('That protocol is not in this lab.');
  const rigs = await listProtocolRigs({ labId: v.labId, protocolId: v.protocolId });
  const rig = rigs.find((r) => r.id === v.rigId && !r.archivedAt) ?? rigs.find((r) => !r.archivedAt) ?? null;
  const spec = onRigClock(v.spec, rig?.clockHz ?? null);
  return db.transaction(async (tx) => {
    if (!(await lockProtocol(tx, { labId: v.labId, protocolId: v.protocolId }))) throw notFound('That protocol is not in this lab.');
    const number = await nextVersionNumber(tx, { labId: v.labId, protocolId: v.protocolId });
    const created = await insertVersion(tx, {
      labId: v.labId,
      protocolId: v.protocolId,
      number,
      spec,
      rigId: rig?.id ?? null,
      authorId: member.user.id,
      copiedFromId: v.id,
    });
    await touchProtocol(tx, { labId: v.labId, protocolId: v.protocolId });
    await recordAudit(tx, {
      labId: v.labId,
      actor: actorOf(member),
      action: 'version.copied',
      subjectType: 'protocol_version',
      subjectId: created.id,
      ip: ctx.ip,
      details: { protocol: v.protocolName, number, from: v.number, fromStatus: v.status },
    });
    return { versionId: created.id, protocolId: v.protocolId, number };
  });
}
