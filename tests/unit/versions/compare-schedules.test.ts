import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseSpec, streamPulses, type Spec } from '@/lib/schedule';
import { COMPARE_TRIALS, compareSchedules } from '@/lib/versions/compare-schedules';

function example(): Spec {
  const r = parseSpec(JSON.parse(readFileSync('lib/schedule/examples/optical-ramp-sine.json', 'utf8')));
  if (!r.ok) throw new Error('example invalid');
  return r.spec;
}

describe('compareSchedules', () => {
  it('shows the first trials of both versions, every pulse accounted for', () => {
    const a = example();
    const b: Spec = { ...a, pulse: { ...a.pulse, amplitude: 5 } }; // timing unchanged
    const r = compareSchedules(a, b);
    expect(r.trials.map((t) => t.trial)).toEqual([0, 1, 2, 3, 4, 5].slice(0, COMPARE_TRIALS));
    expect(r.cutAtS).toBeNull();
    for (const t of r.trials) {
      const n = [...streamPulses(a, { trials: [t.trial] })].length;
      expect(t.unchanged.length).toBe(n);
      expect(t.added.length + t.removed.length).toBe(0);
    }
    expect(r.durationS).toBe(180);
  });

  it('shows no more trials than the shorter version has', () => {
    const a = example();
    expect(compareSchedules(a, { ...a, trials: 2 }).trials).toHaveLength(2);
  });

  it('cuts a schedule too long to draw at one instant for both, so nothing looks removed for lack of generation', () => {
    // 24 h at 40 Hz ≈ 3.5 million pulses in the first trial: far over the drawing budget.
    const a: Spec = { ...example(), envelope: [{ kind: 'ramp', durationS: 86_400, fromHz: 40, toHz: 40 }], caps: undefined, ceilingHz: 50, trials: 1 };
    const b: Spec = { ...a, seed: `${a.seed}-other` }; // different seed: different pulse counts per second
    const r = compareSchedules(a, b);
    expect(r.trials).toHaveLength(1);
    expect(r.cutAtS).not.toBeNull();
    expect(r.cutAtS!).toBeLessThan(86_400);
    const t = r.trials[0]!;
    // One assertion over all onsets: an expect per onset (~400 000) costs seconds.
    const shown = [...t.unchanged, ...t.removed, ...t.added];
    expect(shown.length).toBeGreaterThan(0);
    expect(shown.filter((s) => !(s < r.cutAtS!))).toEqual([]);
    // Same seed against itself: cut at the same point, all shared.
    const same = compareSchedules(a, a).trials[0]!;
    expect(same.removed.length + same.added.length).toBe(0);
  });
});
