/**
 * Test-only data for the rig browser tests, written straight to the test database
 * (DATABASE_URL from scripts/test.mjs): one protocol with an approved v1 and a draft v2 on
 * the demo rig "Bench 2 — blue light", under a unique name so that no other test's
 * acknowledgements or downloads touch them.
 */
import postgres from 'postgres';
import { scanSchedule, type Spec } from '../../../lib/schedule';

export const BENCH_2 = 'Bench 2 — blue light';

export function e2eSpec(seed: string): Spec {
  return {
    format: 'pulseloom-spec/1',
    envelope: [{ kind: 'sine', durationS: 60, meanHz: 6, depthHz: 4, freqHz: 0.2, phaseDeg: 0 }],
    ceilingHz: 12,
    refractory: { absoluteMs: 20, recoveryMs: 0 },
    pulse: { widthMs: 10, amplitude: 3, unit: 'mW' },
    trials: 4,
    seed,
    clockHz: 10_000,
  };
}

function sql() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the browser tests with `npm test -- e2e`');
  return postgres(url, { max: 1, onnotice: () => {} });
}

export async function makeRigVersions(tag: string) {
  const db = sql();
  try {
    const [rig] = await db<{ id: string; lab_id: string }[]>`
      select r.id, r.lab_id from rigs r join labs l on l.id = r.lab_id
      where l.slug = 'harbor-lane' and r.name = ${BENCH_2}`;
    const [officer] = await db<{ id: string }[]>`select id from users where email = 'tomas.reyes@harborlane.test'`;
    const name = `Rig test protocol ${tag}`;
    const [protocol] = await db<{ id: string }[]>`
      insert into protocols (lab_id, name, modality) values (${rig!.lab_id}, ${name}, 'optical') returning id`;
    const approvedSpec = e2eSpec(`e2e-approved-${tag}`);
    const checksum = scanSchedule(approvedSpec).checksum;
    const [approved] = await db<{ id: string }[]>`
      insert into protocol_versions (lab_id, protocol_id, number, status, spec, rig_id, checksum, approved_checksum, decided_by, decided_at, submitted_at)
      values (${rig!.lab_id}, ${protocol!.id}, 1, 'approved', ${db.json(approvedSpec as never)}, ${rig!.id}, ${checksum}, ${checksum}, ${officer!.id}, now(), now())
      returning id`;
    const [draft] = await db<{ id: string }[]>`
      insert into protocol_versions (lab_id, protocol_id, number, status, spec, rig_id)
      values (${rig!.lab_id}, ${protocol!.id}, 2, 'draft', ${db.json(e2eSpec(`e2e-draft-${tag}`) as never)}, ${rig!.id})
      returning id`;
    return { rigId: rig!.id, protocolName: name, approvedId: approved!.id, draftId: draft!.id, checksum };
  } finally {
    await db.end();
  }
}

export async function auditActions(subjectId: string) {
  const db = sql();
  try {
    return await db<{ action: string; actor_label: string; actor_token_id: string | null }[]>`
      select action, actor_label, actor_token_id from audit_log where subject_id = ${subjectId} order by id`;
  } finally {
    await db.end();
  }
}
