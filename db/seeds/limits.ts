import { and, eq, isNull } from 'drizzle-orm';
import * as schema from '../schema';
import { DEMO_ELECTRICAL_PROFILE, DEMO_OPTICAL_PROFILE, limitProfileSchema } from '../../lib/safety';
import { toLimitColumns } from '../queries/limit-profile-shape';
import type { SeedPart } from './index';

/**
 * Harbor Lane's lab-wide limit profiles, one per modality, from the demo values in
 * lib/safety (invented starting points). Skipped when the lab already has a lab-wide
 * profile for the modality, so a second run, or limits the demo officer edited, stay as they are.
 */
export const seedLimitProfiles: SeedPart = async ({ tx, labIds, userIds }) => {
  const labId = labIds['harbor-lane'];
  if (!labId) return;
  const officer = userIds['tomas.reyes@harborlane.test'] ?? null;
  for (const demo of [DEMO_OPTICAL_PROFILE, DEMO_ELECTRICAL_PROFILE]) {
    const profile = limitProfileSchema.parse(demo);
    const [existing] = await tx
      .select({ id: schema.limitProfiles.id })
      .from(schema.limitProfiles)
      .where(
        and(
          eq(schema.limitProfiles.labId, labId),
          eq(schema.limitProfiles.modality, profile.modality),
          isNull(schema.limitProfiles.rigId),
        ),
      )
      .limit(1);
    if (existing) continue;
    await tx.insert(schema.limitProfiles).values({ ...toLimitColumns(profile), labId, updatedBy: officer });
  }
};
