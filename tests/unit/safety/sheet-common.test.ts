import { describe, expect, it } from 'vitest';
import { SAFETY_DISCLAIMER } from '@/lib/safety/cautions';
import { DEMO_ELECTRICAL_PROFILE, DEMO_OPTICAL_PROFILE } from '@/lib/safety/demo-profiles';
import { buildSafetySheet } from '@/lib/safety/sheet';
import { electricalRig, electricalSpec, opticalRig, opticalSpec, row } from './fixtures';

const schedule = { meanRateHz: 20, dutyCycle: 0.1, worstWindowPulses: 30, worstWindowSeconds: 1 };
const sheets = {
  optical: buildSafetySheet({ spec: opticalSpec(), rig: opticalRig(200), profile: DEMO_OPTICAL_PROFILE, schedule }),
  electrical: buildSafetySheet({ spec: electricalSpec(100, 200), rig: electricalRig(6), profile: DEMO_ELECTRICAL_PROFILE, schedule }),
};

describe.each(Object.entries(sheets))('%s sheet, every row', (_, sheet) => {
  it('has a unique id, a label, a unit and help', () => {
    expect(new Set(sheet.rows.map((r) => r.id)).size).toBe(sheet.rows.length);
    for (const r of sheet.rows) {
      expect(r.label).not.toBe('');
      expect(r.help).not.toBe('');
      expect(typeof r.unit).toBe('string');
    }
  });

  it('names its source with a facts tag (a), (b) or (c)', () => {
    for (const r of sheet.rows) expect(r.source, r.id).toMatch(/\((a|b|c)\b/);
  });

  it('keeps limit, direction and margin consistent with its status', () => {
    for (const r of sheet.rows) {
      if (r.status === 'info') expect([r.limit, r.direction, r.margin], r.id).toEqual([null, null, null]);
      if (r.status === 'pass') expect(r.margin, r.id).toBeGreaterThanOrEqual(0);
    }
  });

  it('carries the cautions and the disclaimer', () => {
    expect(sheet.disclaimer).toBe(SAFETY_DISCLAIMER);
    expect(sheet.cautions.map((c) => c.id)).toContain('approval');
  });
});

describe('sheet sources name the published formulas', () => {
  it.each([
    ['optical', 'irradiance', 'E = P / (π r²)'],
    ['optical', 'heating-mean', 'Shin et al. (2016)'],
    ['optical', 'heating-burst-bound', 'Yizhar et al. (2011)'],
    ['optical', 'spread', 'Aravanis et al. (2007)'],
    ['optical', 'peak-rate', 'limit chosen by the lab'],
    ['electrical', 'shannon-k', 'Shannon (1992)'],
    ['electrical', 'charge-per-phase', 'McCreery et al. (1990)'],
    ['electrical', 'electrode-size', 'Cogan'],
  ] as const)('%s %s cites %s', (modality, id, text) => {
    expect(row(sheets[modality], id).source).toContain(text);
  });

  it('marks rules without a published source as common practice', () => {
    expect(row(sheets.optical, 'refractory').source).toContain('common practice, no source');
    expect(row(sheets.optical, 'pulse-width').source).toContain('common practice, no source');
  });
});

describe('modality checks', () => {
  it('refuses an optical profile for an electrical spec and blocks submission', () => {
    const sheet = buildSafetySheet({ spec: electricalSpec(100, 200), rig: electricalRig(6), profile: DEMO_OPTICAL_PROFILE, schedule });
    expect(sheet.rows.map((r) => [r.id, r.status])).toEqual([['profile-modality', 'fail']]);
    expect(sheet.canSubmit).toBe(false);
    expect(sheet.modality).toBe('electrical');
    expect(sheet.cautions.map((c) => c.id)).toContain('charge-damage');
  });

  it('refuses a rig of the other modality and ignores its data', () => {
    const sheet = buildSafetySheet({ spec: opticalSpec(), rig: electricalRig(6), profile: DEMO_OPTICAL_PROFILE, schedule });
    expect(row(sheet, 'rig-modality').status).toBe('fail');
    expect(row(sheet, 'irradiance').value).toBeNull();
    expect(sheet.canSubmit).toBe(false);
  });
});
