import type { LimitProfile } from '@/lib/safety';
import type { Modality } from '@/lib/schedule/spec';
import { limitFieldsFor } from './fields';

// The form edits every limit as two number boxes; an empty box is "not set". These
// helpers turn a stored profile into form values and form values back into the shape
// limitProfileSchema reads, dropping limits with neither level.

type Levels = { hard?: number; warn?: number };

export type LimitFormValues = {
  name: string;
  /** '' = every rig of this modality in the lab. */
  rigId: string;
  whenUnknown: 'warn' | 'fail';
  limits: Record<string, Levels> & { window?: { seconds?: number; maxPulses?: Levels } };
};

const isNumber = (x: unknown): x is number => typeof x === 'number' && !Number.isNaN(x);

function levels(l: Levels | undefined): Levels | undefined {
  if (!l) return undefined;
  const out: Levels = {};
  if (isNumber(l.hard)) out.hard = l.hard;
  if (isNumber(l.warn)) out.warn = l.warn;
  return out.hard === undefined && out.warn === undefined ? undefined : out;
}

/** Form values → the input limitProfileSchema parses (the modality comes from the page). */
export function fromForm(values: LimitFormValues, modality: Modality): Record<string, unknown> {
  const limits: Record<string, unknown> = {};
  for (const f of limitFieldsFor(modality)) {
    const l = levels(values.limits?.[f.key]);
    if (l) limits[f.key] = l;
  }
  const w = values.limits?.window;
  const pulses = levels(w?.maxPulses);
  if (isNumber(w?.seconds) || pulses) limits.window = { seconds: w?.seconds, maxPulses: pulses ?? {} };
  return {
    name: values.name,
    modality,
    rigId: values.rigId ? values.rigId : null,
    whenUnknown: values.whenUnknown,
    limits,
  };
}

export function toForm(profile: LimitProfile | null): LimitFormValues {
  if (!profile) return { name: '', rigId: '', whenUnknown: 'warn', limits: {} };
  return {
    name: profile.name,
    rigId: profile.rigId ?? '',
    whenUnknown: profile.whenUnknown ?? 'warn',
    limits: structuredClone(profile.limits) as LimitFormValues['limits'],
  };
}

/** Empty box → undefined (not NaN), so "not set" never reaches the schema as a bad number. */
export function numberOrUndefined(v: unknown): number | undefined {
  if (v === '' || v === null || v === undefined) return undefined;
  const n = typeof v === 'number' ? v : Number(v);
  return Number.isNaN(n) ? undefined : n;
}
