/**
 * The schedule spec: Pulseloom's own JSON format, version `pulseloom-spec/1`.
 *
 * One zod schema, shared by the envelope editor (react-hook-form), the API and the CLI.
 * Browser-safe: no node: imports.
 *
 * Rules that need more than one field (sine extrema against 0 and the ceiling,
 * envelope against caps.maxRateHz, refractory against pulse width, total duration)
 * live in the schema's superRefine, so every consumer gets the same verdict.
 * Nothing is ever clipped: a spec that breaks a rule is refused with the reason.
 */
import { z } from 'zod';
import { segmentRange } from './envelope';

export const SPEC_FORMAT = 'pulseloom-spec/1' as const;

export const LIMITS = {
  maxDurationS: 86_400,
  maxTrials: 1_000,
  maxSegments: 100_000,
  /** Candidate-cloud height; 10 kHz is far above any useful stimulation rate. */
  maxCeilingHz: 10_000,
  /** Rig timer timebases reach 20–100 MHz (common practice, no source). */
  maxClockHz: 100_000_000,
  maxSeedLength: 256,
  /** A window cap above this is no cap anyone needs; it bounds the engine's ring buffer. */
  maxWindowPulses: 1_000_000,
} as const;

/** Tolerance when comparing a stated pulse width with its phases (floating input like 0.45 ms). */
const WIDTH_TOLERANCE_MS = 1e-9;

/** Missing or non-object value → a readable reason; unknown keys keep zod's own message. */
function objectError(what: string, shape: string) {
  return (iss: { code?: string; input?: unknown }) => {
    if (iss.code !== 'invalid_type') return undefined;
    return iss.input === undefined ? `${what} is required: ${shape}` : `${what} must be an object ${shape}`;
  };
}

const finite = (what: string) =>
  z.number({
    error: (iss) =>
      iss.input === undefined ? `${what} is required` : `${what} must be a finite number`,
  });

const nonNegative = (what: string) => finite(what).min(0, { error: `${what} must be ≥ 0` });
const positive = (what: string) => finite(what).gt(0, { error: `${what} must be > 0` });
const durationS = positive('durationS');

export const rampSegmentSchema = z.strictObject({
  kind: z.literal('ramp'),
  durationS,
  fromHz: nonNegative('fromHz'),
  toHz: nonNegative('toHz'),
});

export const sineSegmentSchema = z.strictObject({
  kind: z.literal('sine'),
  durationS,
  meanHz: nonNegative('meanHz'),
  depthHz: nonNegative('depthHz'),
  freqHz: positive('freqHz'),
  phaseDeg: finite('phaseDeg'),
});

export const segmentSchema = z.discriminatedUnion('kind', [rampSegmentSchema, sineSegmentSchema], {
  error: (iss) =>
    iss.code === 'invalid_union' ? `kind must be "ramp" or "sine"` : 'segment must be an object with a kind',
});

export const refractorySchema = z.strictObject(
  {
  absoluteMs: nonNegative('absoluteMs'),
  /** 0 = none; > 0: h(Δ) = 1 − exp(−(Δ − absolute)/recovery) after the absolute period. */
  recoveryMs: nonNegative('recoveryMs'),
  },
  { error: objectError('refractory', '{ absoluteMs, recoveryMs }') },
);

export const capsSchema = z.strictObject({
  maxRateHz: positive('maxRateHz').optional(),
  window: z
    .strictObject({
      seconds: positive('seconds').max(LIMITS.maxDurationS, { error: `seconds must be ≤ ${LIMITS.maxDurationS}` }),
      maxPulses: finite('maxPulses')
        .refine(Number.isInteger, { error: 'maxPulses must be a whole number' })
        .min(1, { error: 'maxPulses must be ≥ 1' })
        .max(LIMITS.maxWindowPulses, { error: `maxPulses must be ≤ ${LIMITS.maxWindowPulses}` }),
    })
    .optional(),
});

export const phasesSchema = z.strictObject({
  widthUs: positive('widthUs'),
  gapUs: nonNegative('gapUs'),
  leading: z.enum(['cathodic', 'anodic'], { error: 'leading must be "cathodic" or "anodic"' }),
});

export const pulseSchema = z.strictObject(
  {
  /** Whole pulse duration. Electrical: must equal 2 × phases.widthUs + phases.gapUs. */
  widthMs: positive('widthMs'),
  /** Peak power (mW) for light, phase current (µA) for electrical pulses. */
  amplitude: nonNegative('amplitude'),
  unit: z.enum(['mW', 'uA'], { error: 'unit must be "mW" (optical) or "uA" (electrical)' }),
  phases: phasesSchema.optional(),
  },
  { error: objectError('pulse', '{ widthMs, amplitude, unit }') },
);

const formatSchema = z.literal(SPEC_FORMAT, {
  error: (iss) =>
    iss.input === undefined
      ? 'format is required'
      : `unknown format version ${safeJson(iss.input)}; this engine reads "${SPEC_FORMAT}"`,
});

export const specSchema = z
  .strictObject({
    format: formatSchema,
    envelope: z
      .array(segmentSchema, { error: 'envelope must be a list of segments' })
      .min(1, { error: 'envelope needs at least one segment' })
      .max(LIMITS.maxSegments, { error: `envelope has more than ${LIMITS.maxSegments} segments` }),
    ceilingHz: positive('ceilingHz').max(LIMITS.maxCeilingHz, { error: `ceilingHz must be ≤ ${LIMITS.maxCeilingHz}` }),
    refractory: refractorySchema,
    caps: capsSchema.optional(),
    pulse: pulseSchema,
    trials: finite('trials')
      .refine(Number.isInteger, { error: 'trials must be a whole number' })
      .min(1, { error: 'trials must be ≥ 1' })
      .max(LIMITS.maxTrials, { error: `more than ${LIMITS.maxTrials} trials` }),
    seed: z
      .string({ error: 'seed must be a string' })
      .min(1, { error: 'seed must not be empty' })
      .max(LIMITS.maxSeedLength, { error: `seed longer than ${LIMITS.maxSeedLength} characters` }),
    clockHz: finite('clockHz')
      .refine(Number.isInteger, { error: 'clockHz must be a whole number' })
      .min(1, { error: 'clockHz must be ≥ 1' })
      .max(LIMITS.maxClockHz, { error: `clockHz must be ≤ ${LIMITS.maxClockHz}` }),
  })
  .superRefine(
    (spec, ctx) => crossFieldChecks(spec, (i) => ctx.addIssue({ code: 'custom', path: i.path, message: i.message })),
    { when: () => true },
  );

export type Spec = z.infer<typeof specSchema>;
export type Segment = z.infer<typeof segmentSchema>;
export type RampSegment = z.infer<typeof rampSegmentSchema>;
export type SineSegment = z.infer<typeof sineSegmentSchema>;
export type Modality = 'optical' | 'electrical';

export function modalityOf(spec: Pick<Spec, 'pulse'>): Modality {
  return spec.pulse.unit === 'uA' ? 'electrical' : 'optical';
}

/** Whole pulse duration in ms: the width, or both phases plus the gap for a biphasic pulse. */
export function pulseSpanMs(pulse: Spec['pulse']): number {
  if (pulse.unit === 'uA' && pulse.phases) return (2 * pulse.phases.widthUs + pulse.phases.gapUs) / 1000;
  return pulse.widthMs;
}

type Issue = { path: (string | number)[]; message: string };
type Loose = Record<string, unknown>;

const isNum = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
const isObj = (x: unknown): x is Loose => typeof x === 'object' && x !== null && !Array.isArray(x);

/** A segment whose fields all have the right type and sign, or null (its own errors are already listed). */
function wellFormedSegment(x: unknown): Segment | null {
  const r = segmentSchema.safeParse(x);
  return r.success ? r.data : null;
}

/**
 * Runs on every parse, even when other fields already failed (`when: () => true`),
 * so the user sees every problem at once. It therefore reads its input as unknown.
 */
function crossFieldChecks(input: unknown, add: (i: Issue) => void) {
  if (!isObj(input)) return;
  const { ceilingHz, caps, refractory, pulse, clockHz } = input;
  const envelope = Array.isArray(input.envelope) ? input.envelope : [];
  const maxRate = isObj(caps) && isNum(caps.maxRateHz) ? caps.maxRateHz : undefined;

  let T = 0;
  const rampLimitPath = (i: number, seg: RampSegment) => ['envelope', i, seg.toHz > seg.fromHz ? 'toHz' : 'fromHz'];
  for (let i = 0; i < envelope.length; i++) {
    const seg = wellFormedSegment(envelope[i]);
    if (!seg) continue;
    T += seg.durationS;
    const { min, max } = segmentRange(seg);
    if (seg.kind === 'sine' && min < 0) {
      add({ path: ['envelope', i], message: `sine dips to ${fmt(min)} Hz, below 0 (meanHz − depthHz must stay ≥ 0 where the trough falls)` });
    }
    const where = seg.kind === 'ramp' ? rampLimitPath(i, seg) : ['envelope', i];
    if (isNum(ceilingHz) && max > ceilingHz) {
      add({ path: where, message: `rate reaches ${fmt(max)} Hz, above ceilingHz ${ceilingHz}` });
    }
    if (maxRate !== undefined && max > maxRate) {
      add({ path: where, message: `rate reaches ${fmt(max)} Hz, above caps.maxRateHz ${maxRate} (never clipped: lower the envelope or raise the cap)` });
    }
  }
  if (T > LIMITS.maxDurationS) {
    add({ path: ['envelope'], message: `total duration ${fmt(T)} s is more than 24 h (${LIMITS.maxDurationS} s)` });
  }

  if (!isObj(pulse)) return;
  const phases = isObj(pulse.phases) ? pulse.phases : undefined;
  if (pulse.unit === 'uA' && pulse.phases === undefined) {
    add({ path: ['pulse', 'phases'], message: 'electrical pulses (uA) need phases { widthUs, gapUs, leading }' });
  }
  if (pulse.unit === 'mW' && pulse.phases !== undefined) {
    add({ path: ['pulse', 'phases'], message: 'phases apply to electrical pulses (uA) only' });
  }
  const width = isNum(pulse.widthMs) ? pulse.widthMs : NaN;
  let biphasic = NaN;
  if (pulse.unit === 'uA' && phases && isNum(phases.widthUs) && isNum(phases.gapUs)) {
    biphasic = (2 * phases.widthUs + phases.gapUs) / 1000;
    if (isNum(width) && Math.abs(biphasic - width) > WIDTH_TOLERANCE_MS) {
      add({ path: ['pulse', 'widthMs'], message: `a biphasic pulse lasts 2 × widthUs + gapUs = ${fmt(biphasic)} ms; widthMs must equal it` });
    }
  }
  const span = Math.max(isNum(width) ? width : 0, isNum(biphasic) ? biphasic : 0);
  if (isObj(refractory) && isNum(refractory.absoluteMs) && span > 0 && refractory.absoluteMs < span) {
    add({
      path: ['refractory', 'absoluteMs'],
      message: `absolute refractory ${refractory.absoluteMs} ms is shorter than the pulse (${fmt(span)} ms${pulse.unit === 'uA' ? ': both phases and the gap' : ''}); pulses would overlap`,
    });
  }
  if (isNum(clockHz) && clockHz >= 1 && isNum(width) && width > 0 && (width * clockHz) / 1000 < 1) {
    add({ path: ['clockHz'], message: `one clock tick (${fmt(1000 / clockHz)} ms) is longer than the pulse (${width} ms)` });
  }
}

function fmt(x: number): string {
  return String(Math.round(x * 1e6) / 1e6);
}

export interface SpecError {
  path: string;
  message: string;
}

export type ParseSpecResult = { ok: true; spec: Spec } | { ok: false; errors: SpecError[] };

/** `envelope[3].toHz`; the root is `$`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out ? `.${String(key)}` : String(key);
  }
  return out || '$';
}

/** Validate anything (parsed JSON, form state, garbage). Never throws. */
export function parseSpec(input: unknown): ParseSpecResult {
  try {
    const r = specSchema.safeParse(input);
    if (r.success) return { ok: true, spec: r.data };
    return { ok: false, errors: r.error.issues.map((i) => ({ path: formatPath(i.path), message: i.message })) };
  } catch (err) {
    // Getters that throw, proxies, exotic objects: report instead of escaping.
    return { ok: false, errors: [{ path: '$', message: `spec could not be read: ${describe(err)}` }] };
  }
}

function safeJson(x: unknown): string {
  try {
    return JSON.stringify(x)?.slice(0, 80) ?? String(x);
  } catch {
    return 'a non-JSON value';
  }
}

function describe(err: unknown): string {
  try {
    return err instanceof Error ? err.message : String(err);
  } catch {
    return 'unreadable error';
  }
}
