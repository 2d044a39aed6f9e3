import 'server-only';
import { listProtocolRigs } from '@/db/queries/protocols';
import { contributorsOf, getVersion, lastApprovedBefore, listComments, type VersionRow } from '@/db/queries/versions';
import type { Member } from '@/lib/auth/session';
import { AppError } from '@/lib/http/errors';
import { computeSafetySheet, type ReviewSafetySheet } from '@/lib/review/sheet';
import { parseSpec, type Spec, type SpecError } from '@/lib/schedule';
import { diffVersions, type DiffRow } from './diff';
import { availableActions, type VersionAction } from './machine';

export type VersionView = {
  version: VersionRow;
  spec: { ok: true; spec: Spec } | { ok: false; errors: SpecError[] };
  sheet: { ok: true; sheet: ReviewSafetySheet } | { ok: false; message: string } | null;
  contributed: boolean;
  actions: VersionAction[];
  rigs: Awaited<ReturnType<typeof listProtocolRigs>>;
  comments: Awaited<ReturnType<typeof listComments>>;
  source: VersionRow | null;
  sourceComments: Awaited<ReturnType<typeof listComments>>;
  lastApproved: VersionRow | null;
  diffFromApproved: DiffRow[];
};

const rigLabel = (v: VersionRow) => (v.rigName ? `${v.rigName} (${v.rigClockHz} Hz)` : null);

/** Everything the version and review pages show about one version, for this member. */
export async function loadVersionView(member: Member, version: VersionRow): Promise<VersionView> {
  const labId = member.lab.id;
  const [contributors, rigs, comments, source, lastApproved] = await Promise.all([
    contributorsOf({ labId, versionId: version.id, authorId: version.authorId }),
    listProtocolRigs({ labId, protocolId: version.protocolId }),
    listComments({ labId, versionIds: [version.id] }),
    version.copiedFromId ? getVersion({ labId, versionId: version.copiedFromId }) : Promise.resolve(null),
    lastApprovedBefore({ labId, protocolId: version.protocolId, number: version.number }),
  ]);
  const contributed = contributors.has(member.user.id);
  const spec = parseSpec(version.spec);
  let sheet: VersionView['sheet'] = null;
  if (spec.ok) {
    try {
      sheet = { ok: true, sheet: await computeSafetySheet({ labId, spec: spec.spec, rigId: version.rigId }) };
    } catch (err) {
      if (!(err instanceof AppError)) throw err;
      sheet = { ok: false, message: err.message };
    }
  }
  return {
    version,
    spec,
    sheet,
    contributed,
    actions: availableActions(version.status, { roles: member.roles, contributed }),
    rigs,
    comments,
    source,
    sourceComments: source ? await listComments({ labId, versionIds: [source.id] }) : [],
    lastApproved,
    diffFromApproved: lastApproved
      ? diffVersions({ spec: lastApproved.spec, extras: { rig: rigLabel(lastApproved) } }, { spec: version.spec, extras: { rig: rigLabel(version) } })
      : [],
  };
}
