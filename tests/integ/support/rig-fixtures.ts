import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { eq } from 'drizzle-orm';
import { db } from '@/db/client';
import { protocolVersions, protocols } from '@/db/schema';
import type { VersionStatus } from '@/db/schema/protocols';
import { modalityOf, parseSpec, scanSchedule, type Spec } from '@/lib/schedule';

export function exampleSpec(name: 'optical-ramp-sine' | 'electrical-biphasic', over: Partial<Spec> = {}): Spec {
  const raw = JSON.parse(readFileSync(new URL(`../../../lib/schedule/examples/${name}.json`, import.meta.url), 'utf8'));
  const r = parseSpec({ ...raw, ...over });
  if (!r.ok) throw new Error(`example spec invalid: ${r.errors[0]!.path} ${r.errors[0]!.message}`);
  return r.spec;
}

/** A short optical spec (≈ 2 trials × 20 s) for tests that do not care about size. */
export function smallSpec(seed = `t-${randomUUID().slice(0, 6)}`, clockHz = 10_000): Spec {
  return {
    format: 'pulseloom-spec/1',
    envelope: [{ kind: 'ramp', durationS: 20, fromHz: 2, toHz: 8 }],
    ceilingHz: 10,
    refractory: { absoluteMs: 10, recoveryMs: 0 },
    pulse: { widthMs: 5, amplitude: 4, unit: 'mW' },
    trials: 2,
    seed,
    clockHz,
  };
}

/**
 * A protocol with one version in the asked state, taken there the way the review
 * workflow does (draft → in_review with the checksum → approved with approved_checksum),
 * so the database's guards see ordinary transitions.
 */
export async function makeVersion(a: {
  labId: string;
  rigId: string;
  spec: Spec;
  status: VersionStatus;
  decidedBy?: string;
  protocolName?: string;
  number?: number;
  protocolId?: string;
}) {
  let protocolId = a.protocolId;
  const name = a.protocolName ?? `Protocol ${randomUUID().slice(0, 6)}`;
  if (!protocolId) {
    const [p] = await db.insert(protocols).values({ labId: a.labId, name, modality: modalityOf(a.spec) }).returning();
    protocolId = p!.id;
  }
  const [v] = await db
    .insert(protocolVersions)
    .values({ labId: a.labId, protocolId, number: a.number ?? 1, status: 'draft', spec: a.spec, rigId: a.rigId })
    .returning();
  let checksum: string | null = null;
  if (a.status !== 'draft') {
    const scan = scanSchedule(a.spec);
    checksum = scan.checksum;
    await db
      .update(protocolVersions)
      .set({ status: 'in_review', checksum, pulseCount: scan.pulseCount, submittedAt: new Date() })
      .where(eq(protocolVersions.id, v!.id));
  }
  if (a.status === 'approved' || a.status === 'withdrawn') {
    await db
      .update(protocolVersions)
      .set({ status: 'approved', approvedChecksum: checksum, decidedBy: a.decidedBy ?? null, decidedAt: new Date() })
      .where(eq(protocolVersions.id, v!.id));
  }
  if (a.status === 'withdrawn' || a.status === 'returned') {
    await db.update(protocolVersions).set({ status: a.status }).where(eq(protocolVersions.id, v!.id));
  }
  const [row] = await db.select().from(protocolVersions).where(eq(protocolVersions.id, v!.id));
  return { version: row!, protocolId: protocolId!, protocolName: name, checksum };
}
