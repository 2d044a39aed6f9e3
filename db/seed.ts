// Demo data of an invented scenario: the Harbor Lane Circuits Lab (fictional), its three
// people and two rigs, and a second lab for the lab switcher. Idempotent: a second run
// changes nothing.
import { drizzle } from 'drizzle-orm/postgres-js';
import { and, eq } from 'drizzle-orm';
import postgres from 'postgres';
import { runAsScript } from './cli';
import * as schema from './schema';
import { hashPassword } from '../lib/auth/password';
import { DEMO } from './demo';
import { SEED_PARTS, type SeedContext } from './seeds';

export async function seed(url: string): Promise<void> {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  const db = drizzle(sql, { schema, casing: 'snake_case' });
  try {
    await db.transaction(async (tx) => {
      const labIds: Record<string, string> = {};
      for (const lab of DEMO.labs) {
        const [row] = await tx
          .insert(schema.labs)
          .values(lab)
          .onConflictDoUpdate({ target: schema.labs.slug, set: { name: lab.name } })
          .returning({ id: schema.labs.id });
        labIds[lab.slug] = row!.id;
      }

      const userIds: Record<string, string> = {};
      const passwordHash = await hashPassword(DEMO.password);
      for (const person of DEMO.people) {
        let [user] = await tx.select().from(schema.users).where(eq(schema.users.email, person.email)).limit(1);
        if (!user) {
          [user] = await tx
            .insert(schema.users)
            .values({ email: person.email, name: person.name, passwordHash, emailVerified: new Date() })
            .returning();
        }
        userIds[person.email] = user!.id;
        for (const [slug, roles] of Object.entries(person.roles)) {
          await tx
            .insert(schema.memberships)
            .values({ labId: labIds[slug]!, userId: user!.id, roles })
            .onConflictDoNothing();
        }
      }

      const rigIds: Record<string, string> = {};
      for (const rig of DEMO.rigs) {
        const labId = labIds[rig.lab]!;
        let [existing] = await tx
          .select({ id: schema.rigs.id })
          .from(schema.rigs)
          .where(and(eq(schema.rigs.labId, labId), eq(schema.rigs.name, rig.name)))
          .limit(1);
        if (!existing) {
          const { lab: _lab, ...values } = rig;
          [existing] = await tx.insert(schema.rigs).values({ ...values, labId }).returning({ id: schema.rigs.id });
        }
        rigIds[rig.name] = existing!.id;
      }

      // Later parts of the scenario (each idempotent) build on these ids.
      const ctx: SeedContext = { tx, labIds, userIds, rigIds };
      for (const part of SEED_PARTS) await part(ctx);
    });
  } finally {
    await sql.end();
  }
}

runAsScript(import.meta.url, 'seeding', seed, 'demo data ready');
