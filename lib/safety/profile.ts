import { z } from 'zod';

// A limit profile holds a lab's limits for one modality (optionally one rig). One
// schema serves the profile form and the server, so both reject the same input.
//
// Every limit is { hard?, warn? }:
//   beyond `hard` -> fail: the version cannot be submitted;
//   beyond `warn` -> warn: it can be submitted with a written justification;
//   neither set   -> the sheet shows the value as 'not-set' and checks nothing.
// Two numbers per metric instead of a severity switch, because labs commonly keep a
// comfortable working level below the line they will not cross.
// "Beyond" means above for maximum limits and below for minimum limits (only the
// refractory period is a minimum). A value equal to the limit is within it.

const amount = z.number().nonnegative();

function levels(inner: z.ZodNumber, direction: 'max' | 'min') {
  return z
    .object({ hard: inner.optional(), warn: inner.optional() })
    .refine(
      (l) => l.hard === undefined || l.warn === undefined || (direction === 'max' ? l.warn <= l.hard : l.warn >= l.hard),
      {
        message:
          direction === 'max'
            ? 'The warning level must not be above the hard limit.'
            : 'The warning level must not be below the hard limit.',
        path: ['warn'],
      },
    );
}

export const maxLimitSchema = levels(amount, 'max');
export const minLimitSchema = levels(amount, 'min');
// Shannon's k is a sum of logarithms: it is negative for small charges.
export const kLimitSchema = levels(z.number(), 'max');

export type Limit = z.infer<typeof maxLimitSchema>;

export const windowLimitSchema = z.object({
  // The schedule's busiest window is measured over this length (see windowSecondsFor).
  seconds: z.number().positive(),
  maxPulses: levels(z.number().int().nonnegative(), 'max'),
});

const sharedLimits = {
  maxRateHz: maxLimitSchema.optional(),
  minRefractoryMs: minLimitSchema.optional(),
  window: windowLimitSchema.optional(),
  maxDutyCyclePct: levels(z.number().min(0).max(100), 'max').optional(),
  maxTrainDurationS: maxLimitSchema.optional(),
};

export const opticalLimitsSchema = z.object({
  ...sharedLimits,
  maxPulseWidthMs: maxLimitSchema.optional(),
  maxPeakPowerMw: maxLimitSchema.optional(),
  maxMeanPowerMw: maxLimitSchema.optional(),
  maxIrradianceMwPerMm2: maxLimitSchema.optional(),
  // Checked against the mean-power heating estimate (Shin et al. 2016 coefficient).
  maxHeatingC: maxLimitSchema.optional(),
});

export const electricalLimitsSchema = z.object({
  ...sharedLimits,
  // For biphasic pulses the width that sets the charge is one phase, quoted in µs.
  maxPhaseWidthUs: maxLimitSchema.optional(),
  maxChargePerPhaseNc: maxLimitSchema.optional(),
  maxChargeDensityUcPerCm2: maxLimitSchema.optional(),
  maxShannonK: kLimitSchema.optional(),
});

const profileBase = {
  name: z.string().trim().min(1, 'Give the profile a name.').max(120),
  // Empty means the profile covers every rig of this modality in the lab.
  rigId: z.string().min(1).nullable().optional(),
  // What a set limit means when the value cannot be computed (say the rig record lacks
  // its fibre core diameter): 'warn' asks for a justification, 'fail' blocks submission.
  whenUnknown: z.enum(['warn', 'fail']).optional(),
};

export const limitProfileSchema = z.discriminatedUnion('modality', [
  z.object({ ...profileBase, modality: z.literal('optical'), limits: opticalLimitsSchema }),
  z.object({ ...profileBase, modality: z.literal('electrical'), limits: electricalLimitsSchema }),
]);

export type LimitProfile = z.infer<typeof limitProfileSchema>;
export type LimitProfileInput = z.input<typeof limitProfileSchema>;
/** Limits every modality has. */
export type SharedLimits = Pick<OpticalLimits, keyof typeof sharedLimits>;
export type OpticalLimits = z.infer<typeof opticalLimitsSchema>;
export type ElectricalLimits = z.infer<typeof electricalLimitsSchema>;

/** The window length the caller should measure the schedule's busiest window over. */
export function windowSecondsFor(profile: LimitProfile): number | undefined {
  return profile.limits.window?.seconds;
}
