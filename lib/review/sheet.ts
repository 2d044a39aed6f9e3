import 'server-only';
import { createHash } from 'node:crypto';
import { profileFor } from '@/db/queries/limit-profiles';
import { getRig } from '@/db/queries/rigs';
import { buildSafetySheet, demoProfileFor, windowSecondsFor } from '@/lib/safety';
import { canonicalSpecJson, modalityOf, parseSpec, type Spec } from '@/lib/schedule';
import { badRequest, notFound } from '@/lib/http/errors';
import { summarizeSchedule, type MeasuredSummary } from './schedule-summary';
import type { ReviewSafetySheet, SheetProfileInfo } from './types';

export type { ReviewSafetySheet, SheetProfileInfo } from './types';

/**
 * The safety sheet of a spec in a lab: the lab's limits (the rig's own profile first),
 * the rig record for fibre and electrode data, and the schedule the engine generates.
 * Used on the version and review pages and to refuse a submission that fails.
 */
export async function computeSafetySheet({
  labId,
  spec,
  rigId,
}: {
  labId: string;
  spec: Spec | unknown;
  rigId?: string | null;
}): Promise<ReviewSafetySheet> {
  const parsed = parseSpec(spec);
  if (!parsed.ok) throw badRequest('The spec is not valid, so no safety sheet can be computed.', parsed.errors);
  const valid = parsed.spec;
  const modality = modalityOf(valid);

  const rig = rigId ? await getRig({ labId, rigId }) : null;
  if (rigId && !rig) throw notFound('That rig is not in this lab.');

  const stored = await profileFor({ labId, modality, rigId: rig?.id ?? null });
  const profile = stored?.profile ?? demoProfileFor(modality);
  const info: SheetProfileInfo = stored
    ? { id: stored.id, name: profile.name, scope: stored.rigId ? 'rig' : 'lab', rigName: stored.rigName }
    : { id: null, name: profile.name, scope: 'demo', rigName: null };

  const schedule = cachedSummary(valid, windowSecondsFor(profile));
  const sheet = buildSafetySheet({ spec: valid, profile, rig, schedule: schedule.measured ? schedule : null });
  return { ...sheet, profile: info, schedule };
}

// A schedule depends only on its spec, so its summary is computed once per spec and
// window length; a version page and the submit that follows share the work.
const CACHE_SIZE = 64;
const cache = new Map<string, MeasuredSummary>();

function cachedSummary(spec: Spec, windowSeconds: number | undefined): MeasuredSummary {
  const key = createHash('sha256').update(canonicalSpecJson(spec)).update(`|${windowSeconds ?? ''}`).digest('hex');
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const summary = summarizeSchedule(spec, windowSeconds);
  cache.set(key, summary);
  if (cache.size > CACHE_SIZE) cache.delete(cache.keys().next().value!);
  return summary;
}
