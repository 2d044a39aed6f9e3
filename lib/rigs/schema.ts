/**
 * Rig records and rig tokens: one schema each, shared by the forms (react-hook-form) and
 * the server actions. Browser-safe.
 *
 * Ranges are sanity bounds on what a lab could type, not safety limits (those live in
 * limit profiles): they catch unit slips such as a core diameter entered in mm.
 */
import { z } from 'zod';
import { LIMITS } from '@/lib/schedule/spec';

const num = (what: string) =>
  z.number({ error: (iss) => (iss.input === undefined || Number.isNaN(iss.input) ? `Enter ${what}` : `${what} must be a number`) });

const whole = (what: string) => num(what).refine(Number.isInteger, { error: `${what} must be a whole number` });

const common = {
  name: z.string().trim().min(1, 'Give the rig a name').max(80, 'At most 80 characters'),
  // Rig timer timebases reach 20–100 MHz (common practice, no source); the engine refuses more.
  clockHz: whole('the output clock').min(1, 'The clock must be at least 1 Hz').max(LIMITS.maxClockHz, `At most ${LIMITS.maxClockHz.toLocaleString('en')} Hz`),
  channels: whole('the number of channels').min(1, 'At least one channel').max(256, 'At most 256 channels'),
  notes: z.string().trim().max(2000, 'At most 2000 characters').default(''),
};

export const opticalRigSchema = z.object({
  modality: z.literal('optical'),
  ...common,
  // Optogenetic sources span near-UV to near-IR (common practice, no source).
  wavelengthNm: num('the wavelength').min(300, 'Wavelength is in nm: 300–1200').max(1200, 'Wavelength is in nm: 300–1200'),
  fibreCoreUm: num('the fibre core diameter').gt(0, 'Core diameter must be > 0 µm').max(3000, 'Core diameter is in µm: at most 3000'),
  // A numerical aperture is below the refractive index of the medium; fibres in use sit well under 1.
  fibreNA: num('the numerical aperture').gt(0, 'NA must be > 0').lt(1, 'NA must be below 1'),
});

export const electricalRigSchema = z.object({
  modality: z.literal('electrical'),
  ...common,
  electrodeMaterial: z.string().trim().min(1, 'Name the electrode material').max(80, 'At most 80 characters'),
  // Geometric area in mm²: microelectrodes ~1e-4 mm², macro contacts a few mm² (common practice, no source).
  electrodeAreaMm2: num('the geometric area').gt(0, 'Area must be > 0 mm²').max(100, 'Area is in mm²: at most 100'),
});

export const rigSchema = z.discriminatedUnion('modality', [opticalRigSchema, electricalRigSchema], {
  error: 'Pick optical or electrical',
});
export type RigInput = z.input<typeof rigSchema>;
export type RigValues = z.output<typeof rigSchema>;

const rigId = z.uuid({ error: 'Unknown rig' });

export const rigUpdateSchema = z.discriminatedUnion('modality', [
  opticalRigSchema.extend({ rigId }),
  electricalRigSchema.extend({ rigId }),
]);
export type RigUpdateInput = z.input<typeof rigUpdateSchema>;

export const rigRefSchema = z.object({ rigId });

export const TOKEN_PREFIX = 'plr_';
export const TOKEN_MAX_DAYS = 730;

export const tokenCreateSchema = z.object({
  rigId,
  name: z.string().trim().min(1, 'Name the token, e.g. the PC it goes on').max(60, 'At most 60 characters'),
  expiresInDays: whole('the days until it expires').min(1, 'At least 1 day').max(TOKEN_MAX_DAYS, `At most ${TOKEN_MAX_DAYS} days`),
});
export type TokenCreateInput = z.input<typeof tokenCreateSchema>;

export const tokenRevokeSchema = z.object({ rigId, tokenId: z.uuid({ error: 'Unknown token' }) });

/** The record as the forms edit it: null columns become blanks of the other modality. */
export function rigFormValues(rig: {
  modality: 'optical' | 'electrical';
  name: string;
  clockHz: number;
  channels: number;
  notes: string | null;
  wavelengthNm: number | null;
  fibreCoreUm: number | null;
  fibreNA: number | null;
  electrodeMaterial: string | null;
  electrodeAreaMm2: number | null;
}): RigInput {
  const base = { name: rig.name, clockHz: rig.clockHz, channels: rig.channels, notes: rig.notes ?? '' };
  return rig.modality === 'optical'
    ? { modality: 'optical', ...base, wavelengthNm: rig.wavelengthNm ?? NaN, fibreCoreUm: rig.fibreCoreUm ?? NaN, fibreNA: rig.fibreNA ?? NaN }
    : { modality: 'electrical', ...base, electrodeMaterial: rig.electrodeMaterial ?? '', electrodeAreaMm2: rig.electrodeAreaMm2 ?? NaN };
}
