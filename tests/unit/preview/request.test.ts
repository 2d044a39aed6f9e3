import { describe, expect, it } from 'vitest';
import { parsePreviewRequest, previewRequestSchema } from '@/lib/preview';
import { opticalSpec } from './spec-fixture';

describe('previewRequestSchema', () => {
  it('defaults to 5 trials and accepts 1 to 20', () => {
    expect(previewRequestSchema.parse({ spec: {} }).trials).toBe(5);
    expect(previewRequestSchema.safeParse({ spec: {}, trials: 1 }).success).toBe(true);
    expect(previewRequestSchema.safeParse({ spec: {}, trials: 20 }).success).toBe(true);
    for (const trials of [0, 21, 2.5, '3']) expect(previewRequestSchema.safeParse({ spec: {}, trials }).success).toBe(false);
  });
});

describe('parsePreviewRequest', () => {
  it('returns the spec and trial count', () => {
    const r = parsePreviewRequest({ spec: opticalSpec(), trials: 3 });
    expect(r).toEqual({ ok: true, spec: opticalSpec(), trials: 3 });
  });

  it('reports request problems at their field', () => {
    expect(parsePreviewRequest({ trials: 50 })).toEqual({
      ok: false,
      errors: expect.arrayContaining([
        { path: 'spec', message: 'spec is required' },
        { path: 'trials', message: 'trials must be ≤ 20' },
      ]),
    });
    expect(parsePreviewRequest('nonsense')).toMatchObject({ ok: false, errors: [{ path: '$' }] });
  });

  it('reports spec problems at the engine’s paths, ready for a 400 body', () => {
    const spec = opticalSpec({ envelope: [{ kind: 'ramp', durationS: 10, fromHz: 5, toHz: 140 }] });
    const r = parsePreviewRequest({ spec });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => e.path)).toContain('envelope[0].toHz');
  });
});
