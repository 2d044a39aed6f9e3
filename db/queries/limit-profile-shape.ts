import { limitProfileSchema, type LimitProfile } from '../../lib/safety';

// How a limit profile sits in its row: name, modality and rig in their own columns;
// the `limits` jsonb holds the limits plus the profile's `whenUnknown` choice. One
// place for the shape, shared by the query module and the demo seed (which runs
// outside Next.js and cannot import server-only modules).

export function toLimitColumns(profile: LimitProfile) {
  return {
    name: profile.name,
    modality: profile.modality,
    rigId: profile.rigId ?? null,
    limits: { ...profile.limits, ...(profile.whenUnknown ? { whenUnknown: profile.whenUnknown } : {}) },
  };
}

/** Re-parses a stored row with the shared schema; a row edited by hand is never trusted. */
export function fromLimitColumns(row: { name: string; modality: string; rigId: string | null; limits: unknown }) {
  const { whenUnknown, ...limits } = (row.limits ?? {}) as Record<string, unknown>;
  return limitProfileSchema.safeParse({ name: row.name, modality: row.modality, rigId: row.rigId, whenUnknown, limits });
}
