import { describe, expect, it } from 'vitest';
import { issuesByKnot, validateDoc } from '@/components/canvas/model';
import { doc, hold, ramp, sine } from './helpers';

describe('validateDoc', () => {
  it('finds nothing wrong with a valid envelope', () => {
    expect(validateDoc(doc(ramp(10, 5, 40), sine(20, 20, 15, 2)), { ceilingHz: 100, maxRateHz: 80 })).toEqual([]);
  });

  it('puts an error marker on the point above the ceiling, with the reason', () => {
    const issues = validateDoc(doc(ramp(4, 5, 120), ramp(6, 120, 40)), { ceilingHz: 100 });
    const marks = issuesByKnot(issues);
    expect([...marks.keys()]).toEqual(['1']);
    expect(marks.get('1')![0].message).toMatch(/120 Hz.*ceilingHz 100/);
    expect(marks.get('1')![0].at).toMatchObject({ kind: 'point', t: 4, hz: 120 });
  });

  it('marks both ends of a ramp when both break the cap', () => {
    const issues = validateDoc(doc(ramp(4, 5, 10), ramp(6, 90, 85)), { ceilingHz: 100, maxRateHz: 80 });
    const keys = issues.filter((i) => i.at.kind === 'point').map((i) => (i.at as { key: string }).key);
    expect(keys.sort()).toEqual(['1>', '2<']);
    for (const i of issues) expect(i.message).toMatch(/maxRateHz 80/);
  });

  it('marks a sine over the ceiling, or dipping below 0, as a segment', () => {
    const issues = validateDoc(doc(hold(1, 5), sine(2, 90, 20, 1), sine(2, 5, 10, 1)), { ceilingHz: 100 });
    const bySeg = issues.map((i) => [i.at.kind === 'segment' ? i.at.index : -1, i.message]);
    expect(bySeg).toEqual([
      [1, expect.stringMatching(/110 Hz, above ceilingHz/)],
      [2, expect.stringMatching(/below 0/)],
    ]);
    expect(issues[0].at).toMatchObject({ t0: 1, t1: 3 });
  });

  it('reports an empty envelope and bad numbers where they are', () => {
    expect(validateDoc(doc(), { ceilingHz: 100 })).toEqual([expect.objectContaining({ path: 'envelope', at: { kind: 'envelope' } })]);
    const bad = validateDoc(doc(ramp(0, 5, 5), hold(2, 1)), { ceilingHz: 100 });
    expect(bad).toEqual([expect.objectContaining({ path: 'envelope[0].durationS', at: expect.objectContaining({ kind: 'segment', index: 0 }) })]);
  });

  it('ignores problems outside the envelope (the settings form shows those)', () => {
    expect(validateDoc(doc(hold(2, 1)), { ceilingHz: 20_000 })).toEqual([]);
  });
});

describe('locateIssues', () => {
  it('places the errors of a whole-spec validation exactly as validateDoc does', async () => {
    const { parseSpec, SPEC_FORMAT } = await import('@/lib/schedule/spec');
    const { locateIssues } = await import('@/components/canvas/model');
    const d = doc(ramp(4, 5, 120), sine(2, 90, 20, 1), hold(3, 85));
    const ctx = { ceilingHz: 100, maxRateHz: 80 };
    const r = parseSpec({
      format: SPEC_FORMAT,
      envelope: d.segments,
      ceilingHz: 100,
      caps: { maxRateHz: 80 },
      refractory: { absoluteMs: 0.1, recoveryMs: 0 }, // also wrong, but not the envelope's business
      pulse: { widthMs: 5, amplitude: 1, unit: 'mW' },
      trials: 1,
      seed: 's',
      clockHz: 10000,
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const located = locateIssues(d, r.errors, ctx);
    expect(located).toEqual(validateDoc(d, ctx));
    expect(located.some((i) => i.path.startsWith('refractory'))).toBe(false);
    expect(located.length).toBeGreaterThanOrEqual(4);
  });
});
