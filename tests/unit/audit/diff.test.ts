import { describe, expect, it } from 'vitest';
import { describeChanges } from '@/lib/audit/diff';

describe('describeChanges', () => {
  it('lists changed, added and removed leaves by path, in key order', () => {
    const before = { name: 'A', limits: { maxRateHz: { hard: 100, warn: 40 }, maxTrainDurationS: { hard: 600 } } };
    const after = { name: 'A', limits: { maxRateHz: { hard: 80, warn: 40 }, maxPeakPowerMw: { warn: 20 } } };
    expect(describeChanges(before, after)).toEqual([
      'limits.maxPeakPowerMw: (not set) → {"warn":20}',
      'limits.maxRateHz.hard: 100 → 80',
      'limits.maxTrainDurationS: {"hard":600} → (not set)',
    ]);
  });

  it('says nothing when nothing changed, and compares arrays whole', () => {
    expect(describeChanges({ a: [1, 2], b: { c: null } }, { b: { c: null }, a: [1, 2] })).toEqual([]);
    expect(describeChanges({ a: [1, 2] }, { a: [2, 1] })).toEqual(['a: [1,2] → [2,1]']);
  });
});
