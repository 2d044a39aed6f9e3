import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { diffValues, diffVersions, flatten } from '@/lib/versions/diff';

const optical = JSON.parse(readFileSync('lib/schedule/examples/optical-ramp-sine.json', 'utf8'));

describe('diffValues', () => {
  it('finds nothing between a spec and a copy of it', () => {
    expect(diffValues(optical, structuredClone(optical))).toEqual([]);
  });

  it('reports each changed leaf once with its path', () => {
    const next = structuredClone(optical);
    next.envelope[2].meanHz = 9;
    next.pulse.amplitude = 5;
    next.seed = 'other';
    expect(diffValues(optical, next)).toEqual([
      { path: 'envelope[2].meanHz', before: '10', after: '9', change: 'changed' },
      { path: 'pulse.amplitude', before: '6.5', after: '5', change: 'changed' },
      { path: 'seed', before: 'vole-hippocampus-cohort-B/day-3', after: 'other', change: 'changed' },
    ]);
  });

  it('lists an added segment field by field, ordered by index (10 after 9, not after 1)', () => {
    const a = { envelope: Array.from({ length: 10 }, (_, i) => ({ toHz: i })) };
    const b = { envelope: [...a.envelope, { toHz: 10 }] };
    b.envelope[1] = { toHz: 99 };
    expect(diffValues(a, b).map((r) => `${r.path}:${r.change}`)).toEqual(['envelope[1].toHz:changed', 'envelope[10].toHz:added']);
  });

  it('reports a removed optional block', () => {
    const next = structuredClone(optical);
    delete next.caps.window;
    const rows = diffValues(optical, next);
    expect(rows.map((r) => [r.path, r.change])).toEqual([
      ['caps.window.maxPulses', 'removed'],
      ['caps.window.seconds', 'removed'],
    ]);
  });
});

describe('diffVersions', () => {
  it('puts the rig first when it changed', () => {
    const next = { ...optical, clockHz: 10000 };
    const rows = diffVersions({ spec: optical, extras: { rig: 'Bench 2' } }, { spec: next, extras: { rig: 'Bench 7' } });
    expect(rows.map((r) => r.path)).toEqual(['rig', 'clockHz']);
  });
});

describe('flatten', () => {
  it('keeps empty containers visible', () => {
    expect([...flatten({ caps: {}, list: [] })]).toEqual([
      ['caps', '{}'],
      ['list', '[]'],
    ]);
  });
});
