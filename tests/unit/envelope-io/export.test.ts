import { describe, expect, it } from 'vitest';
import { rateAt } from '@/lib/schedule/envelope';
import { parseSpec, SPEC_FORMAT, type Spec } from '@/lib/schedule/spec';
import { envelopeToCsv, envelopeToPoints, envelopeToSpecJson, parseEnvelopeCsv, pointsToEnvelope } from '@/lib/envelope-io';

const envelope: Spec['envelope'] = [
  { kind: 'ramp', durationS: 10, fromHz: 5, toHz: 40 },
  { kind: 'ramp', durationS: 2.5, fromHz: 40, toHz: 40 },
  { kind: 'ramp', durationS: 7.5, fromHz: 12, toHz: 0.1 },
];

describe('envelope CSV export', () => {
  it('writes a header and one row per breakpoint, a step as two rows at one time', () => {
    expect(envelopeToCsv(envelope)).toBe('time_s,rate_hz\n0,5\n10,40\n12.5,40\n12.5,12\n20,0.1\n');
  });

  it('reads back to the same ramps', () => {
    const r = parseEnvelopeCsv(envelopeToCsv(envelope));
    expect(r.ok).toBe(true);
    expect(pointsToEnvelope(r.points)).toEqual(envelope);
  });

  it('samples a sine on the curve (the spec JSON keeps it exact)', () => {
    const withSine: Spec['envelope'] = [...envelope, { kind: 'sine', durationS: 2, meanHz: 20, depthHz: 15, freqHz: 2, phaseDeg: 0 }];
    const pts = envelopeToPoints(withSine, 16);
    const sinePts = pts.filter((p) => p.t > 20);
    expect(sinePts.length).toBeGreaterThanOrEqual(2 * 2 * 16);
    for (const p of sinePts.slice(0, -1)) expect(p.hz).toBeCloseTo(rateAt(withSine, p.t), 6);
  });
});

describe('pointsToEnvelope', () => {
  const late = [
    { t: 2, hz: 10 },
    { t: 5, hz: 20 },
  ];
  it('shifts a trace that starts late to 0 s, or holds its first rate from 0 s', () => {
    expect(pointsToEnvelope(late, 'shift')).toEqual([{ kind: 'ramp', durationS: 3, fromHz: 10, toHz: 20 }]);
    expect(pointsToEnvelope(late, 'hold')).toEqual([
      { kind: 'ramp', durationS: 2, fromHz: 10, toHz: 10 },
      { kind: 'ramp', durationS: 3, fromHz: 10, toHz: 20 },
    ]);
  });
});

describe('spec JSON export', () => {
  it('is the spec, readable by the engine', () => {
    const spec: Spec = {
      format: SPEC_FORMAT,
      envelope: [{ kind: 'sine', durationS: 20, meanHz: 20, depthHz: 15, freqHz: 2, phaseDeg: 0 }],
      ceilingHz: 100,
      refractory: { absoluteMs: 10, recoveryMs: 0 },
      pulse: { widthMs: 5, amplitude: 10, unit: 'mW' },
      trials: 20,
      seed: 'bench-7',
      clockHz: 10000,
    };
    const parsed = parseSpec(JSON.parse(envelopeToSpecJson(spec)));
    expect(parsed).toEqual({ ok: true, spec });
  });
});
