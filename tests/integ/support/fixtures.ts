import { randomUUID } from 'node:crypto';
import { db } from '@/db/client';
import { labs, memberships, rigs, users } from '@/db/schema';
import type { Role } from '@/lib/auth/roles';

/** A fresh lab with one member per role asked for; names are unique per call. */
export async function makeLab(roles: Record<string, Role[]> = { exp: ['experimenter'], officer: ['safety_officer'], admin: ['lab_admin'] }) {
  const tag = randomUUID().slice(0, 8);
  const [lab] = await db.insert(labs).values({ slug: `lab-${tag}`, name: `Test lab ${tag}` }).returning();
  const people: Record<string, { id: string; email: string }> = {};
  for (const [key, r] of Object.entries(roles)) {
    const [u] = await db.insert(users).values({ email: `${key}-${tag}@example.test`, name: `${key} ${tag}` }).returning();
    await db.insert(memberships).values({ labId: lab!.id, userId: u!.id, roles: r });
    people[key] = { id: u!.id, email: u!.email! };
  }
  return { lab: lab!, people, tag };
}

export async function makeRig(labId: string, over: Partial<typeof rigs.$inferInsert> = {}) {
  const [rig] = await db
    .insert(rigs)
    .values({ labId, name: `rig ${randomUUID().slice(0, 6)}`, modality: 'optical', clockHz: 10_000, fibreCoreUm: 200, ...over })
    .returning();
  return rig!;
}
