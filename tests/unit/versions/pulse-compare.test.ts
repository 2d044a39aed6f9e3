import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseSpec, streamPulses, type Spec } from '@/lib/schedule';
import { compareTrial, summarizeComparison } from '@/lib/versions/pulse-compare';

function load(file: string): Spec {
  const r = parseSpec(JSON.parse(readFileSync(`lib/schedule/examples/${file}`, 'utf8')));
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.spec;
}

function onsets(spec: Spec, trial: number): number[] {
  return [...streamPulses(spec, { trials: [trial] })].map((p) => p.onsetSample);
}

describe('compareTrial on hand-made samples', () => {
  it('splits two sorted lists into shared, removed and added onsets', () => {
    const r = compareTrial(0, { samples: [10, 20, 30, 50], clockHz: 10 }, { samples: [10, 25, 30, 60, 70], clockHz: 10 });
    expect(r.unchanged).toEqual([1, 3]);
    expect(r.removed).toEqual([2, 5]);
    expect(r.added).toEqual([2.5, 6, 7]);
  });

  it('matches onsets across clocks by time: sample 3 at 10 kHz is sample 6 at 20 kHz', () => {
    const r = compareTrial(0, { samples: [3, 5], clockHz: 10_000 }, { samples: [6, 11], clockHz: 20_000 });
    expect(r.unchanged).toEqual([0.0003]);
    expect(r.removed).toEqual([0.0005]);
    expect(r.added).toEqual([0.00055]);
  });

  it('stays exact where doubles would not: 86 000 s at 100 MHz against 99,999,999 Hz', () => {
    const m = 86_000;
    const a = m * 100_000_000; // m seconds at 100 MHz
    const b = m * 99_999_999; // m seconds at 99 999 999 Hz
    const same = compareTrial(0, { samples: [a], clockHz: 100_000_000 }, { samples: [b], clockHz: 99_999_999 });
    expect(same.unchanged).toEqual([m]);
    // a+1 and b+1 are 10 ns and ~10 ns after m s, 1e-16 s apart: doubles see one instant.
    expect((a + 1) * 99_999_999 === (b + 1) * 100_000_000).toBe(true);
    const off = compareTrial(0, { samples: [a + 1], clockHz: 100_000_000 }, { samples: [b + 1], clockHz: 99_999_999 });
    expect(off.unchanged).toEqual([]);
    expect(off.removed.length + off.added.length).toBe(2);
  });
});

describe('compareTrial on the engine (coupling)', () => {
  it('finds every pulse unchanged between a spec and itself', () => {
    const spec = load('optical-ramp-sine.json');
    const s = onsets(spec, 0);
    const r = compareTrial(0, { samples: s, clockHz: spec.clockHz }, { samples: s, clockHz: spec.clockHz });
    expect(r.unchanged.length).toBe(s.length);
    expect(r.added.length + r.removed.length).toBe(0);
  });

  it('keeps every pulse before a changed last segment, and most after it when the change is small', () => {
    // Causality: thinning with refractoriness and window caps looks only backwards in time,
    // so a change that starts at t0 cannot move a pulse before t0 (common practice, no source).
    const v1 = load('optical-ramp-sine.json');
    const v2: Spec = structuredClone(v1);
    const last = v2.envelope[2]!;
    if (last.kind !== 'sine') throw new Error('example changed');
    last.meanHz = 9; // 10 → 9 Hz mean over the last 90 s
    const t0 = v1.envelope[0]!.durationS + v1.envelope[1]!.durationS;
    const trials = [0, 1, 2].map((t) =>
      compareTrial(t, { samples: onsets(v1, t), clockHz: v1.clockHz }, { samples: onsets(v2, t), clockHz: v2.clockHz }),
    );
    for (const t of trials) {
      for (const s of [...t.removed, ...t.added]) expect(s).toBeGreaterThanOrEqual(t0);
    }
    const sum = summarizeComparison(trials);
    expect(sum.removed + sum.added).toBeGreaterThan(0);
    expect(sum.unchanged).toBeGreaterThan(4 * (sum.removed + sum.added));
  });

  it('shares almost nothing between two seeds', () => {
    const v1 = load('optical-ramp-sine.json');
    const v2: Spec = { ...v1, seed: 'a different seed' };
    const r = compareTrial(0, { samples: onsets(v1, 0), clockHz: v1.clockHz }, { samples: onsets(v2, 0), clockHz: v2.clockHz });
    expect(r.unchanged.length).toBeLessThan(0.05 * (r.removed.length + r.unchanged.length));
  });
});
