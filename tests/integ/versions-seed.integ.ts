import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { db } from '@/db/client';
import { seed } from '@/db/seed';
import { labs, protocolVersions, protocols, rigs, users } from '@/db/schema';
import { computeSafetySheet } from '@/lib/review/sheet';
import { scanSchedule, parseSpec } from '@/lib/schedule';

async function demoVersions() {
  const [lab] = await db.select().from(labs).where(eq(labs.slug, 'harbor-lane'));
  return db
    .select({ protocol: protocols.name, number: protocolVersions.number, status: protocolVersions.status, v: protocolVersions, rig: rigs.name, rigClock: rigs.clockHz })
    .from(protocolVersions)
    .innerJoin(protocols, eq(protocols.id, protocolVersions.protocolId))
    .innerJoin(rigs, eq(rigs.id, protocolVersions.rigId))
    .where(and(eq(protocolVersions.labId, lab!.id)))
    .orderBy(protocols.name, protocolVersions.number);
}

describe('demo protocols seed', () => {
  it('makes an approved v1 and a draft v2 on Bench 2 and an electrical version in review on Bench 5, once', async () => {
    await seed(process.env.DATABASE_URL!);
    const first = await demoVersions();
    await seed(process.env.DATABASE_URL!);
    const second = await demoVersions();
    expect(second.map((r) => r.v.id)).toEqual(first.map((r) => r.v.id));

    const byName = (n: string) => first.filter((r) => r.protocol === n);
    const light = byName('Theta-paced light, dorsal CA1');
    expect(light.map((r) => [r.number, r.status, r.rig])).toEqual([
      [1, 'approved', 'Bench 2 — blue light'],
      [2, 'draft', 'Bench 2 — blue light'],
    ]);
    const [ada] = await db.select().from(users).where(eq(users.email, 'ada.quill@harborlane.test'));
    const [tomas] = await db.select().from(users).where(eq(users.email, 'tomas.reyes@harborlane.test'));
    const v1 = light[0]!.v;
    expect(v1).toMatchObject({ authorId: ada!.id, decidedBy: tomas!.id });
    const spec = parseSpec(v1.spec);
    if (!spec.ok) throw new Error('seeded spec invalid');
    expect(spec.spec.clockHz).toBe(light[0]!.rigClock);
    // The approval holds the checksum the engine gives for the stored spec.
    expect(v1.approvedChecksum).toBe(scanSchedule(spec.spec).checksum);
    expect(v1.checksum).toBe(v1.approvedChecksum);

    const stim = byName('Random-timing microstimulation, HVC');
    expect(stim.map((r) => [r.number, r.status, r.rig])).toEqual([[1, 'in_review', 'Bench 5 — microstim']]);
    // A version in review must be one that could have been submitted under the lab's limits.
    const sheet = await computeSafetySheet({ labId: stim[0]!.v.labId, spec: stim[0]!.v.spec, rigId: stim[0]!.v.rigId });
    expect(sheet.canSubmit).toBe(true);
    expect(sheet.needsJustification ? stim[0]!.v.justification : 'n/a').toBeTruthy();
  });
});
