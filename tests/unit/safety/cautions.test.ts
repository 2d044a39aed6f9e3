import { describe, expect, it } from 'vitest';
import { CAUTIONS, SAFETY_DISCLAIMER, cautionsFor } from '@/lib/safety/cautions';

// What the cautions must cover is set by the product (issue 5 and the export step):
// light and heat, charge and electrode damage, laser safety, the institution's approval.

describe('cautions', () => {
  it('have unique ids, a title, a body and at least one modality each', () => {
    expect(new Set(CAUTIONS.map((c) => c.id)).size).toBe(CAUTIONS.length);
    for (const c of CAUTIONS) {
      expect(c.title.trim()).not.toBe('');
      expect(c.body.length).toBeGreaterThan(40);
      expect(c.appliesTo.length).toBeGreaterThan(0);
      expect(c.sources.length).toBeGreaterThan(0);
    }
  });

  it('give optical users light heating, laser safety and the approval, and nothing about charge', () => {
    const ids = cautionsFor('optical').map((c) => c.id);
    expect(ids).toEqual(expect.arrayContaining(['light-heat', 'laser-eye', 'approval']));
    expect(ids).not.toContain('charge-damage');
    expect(ids.at(-1)).toBe('approval');
  });

  it('give electrical users charge and electrode damage and the approval, and nothing about lasers', () => {
    const ids = cautionsFor('electrical').map((c) => c.id);
    expect(ids).toEqual(expect.arrayContaining(['charge-damage', 'approval']));
    expect(ids).not.toContain('laser-eye');
    expect(ids).not.toContain('light-heat');
    expect(ids.at(-1)).toBe('approval');
  });

  it('cite the published sources behind the heating and charge cautions', () => {
    const byId = Object.fromEntries(CAUTIONS.map((c) => [c.id, c.sources.join(' ')]));
    expect(byId['light-heat']).toContain('Owen');
    expect(byId['charge-damage']).toContain('Shannon (1992)');
    expect(byId['charge-damage']).toContain('Cogan');
  });

  it('say plainly that the sheet supports and does not replace approval, regulations and licensed practice', () => {
    expect(SAFETY_DISCLAIMER).toMatch(/supports, and does not replace/);
    expect(SAFETY_DISCLAIMER).toMatch(/approved animal protocol/);
    expect(SAFETY_DISCLAIMER).toMatch(/local regulations/);
    expect(SAFETY_DISCLAIMER).toMatch(/licensed practice/);
  });
});
