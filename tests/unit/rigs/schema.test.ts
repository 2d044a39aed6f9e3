import { describe, expect, it } from 'vitest';
import { rigSchema, tokenCreateSchema } from '@/lib/rigs/schema';

const paths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  (r.error?.issues ?? []).map((i) => i.path.join('.')).sort();

describe('rig schema', () => {
  it('asks optical rigs for wavelength, core diameter and NA, electrical rigs for material and area', () => {
    const base = { name: 'Bench', clockHz: 10_000, channels: 1 };
    expect(paths(rigSchema.safeParse({ modality: 'optical', ...base }))).toEqual(['fibreCoreUm', 'fibreNA', 'wavelengthNm']);
    expect(paths(rigSchema.safeParse({ modality: 'electrical', ...base }))).toEqual(['electrodeAreaMm2', 'electrodeMaterial']);
    expect(rigSchema.safeParse({ modality: 'optical', ...base, wavelengthNm: 473, fibreCoreUm: 200, fibreNA: 0.39 }).success).toBe(true);
  });

  it('refuses blanks from number inputs (NaN), fractional clocks and NA ≥ 1', () => {
    const r = rigSchema.safeParse({ modality: 'optical', name: ' ', clockHz: 10_000.5, channels: NaN, wavelengthNm: 473, fibreCoreUm: 200, fibreNA: 1.2 });
    expect(paths(r)).toEqual(['channels', 'clockHz', 'fibreNA', 'name']);
    const msg = r.error!.issues.find((i) => i.path[0] === 'channels')!.message;
    expect(msg).toBe('Enter the number of channels');
  });
});

describe('token schema', () => {
  it('needs a name and 1–730 days', () => {
    const rigId = '3f0c2a4e-8d1b-4c6a-9e2f-5b7d8a9c0e1f';
    expect(tokenCreateSchema.safeParse({ rigId, name: 'pc', expiresInDays: 30 }).success).toBe(true);
    expect(paths(tokenCreateSchema.safeParse({ rigId, name: '', expiresInDays: 0 }))).toEqual(['expiresInDays', 'name']);
    expect(paths(tokenCreateSchema.safeParse({ rigId, name: 'pc', expiresInDays: 731 }))).toEqual(['expiresInDays']);
  });
});
