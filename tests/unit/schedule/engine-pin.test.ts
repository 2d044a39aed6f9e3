/**
 * Regression pin, not a correctness oracle: the promise is that a spec read as
 * pulseloom-spec/1 and run by engine pulseloom-thinning/1 gives the same pulses on any
 * machine and in every later release. Correctness is tested elsewhere (statistics,
 * properties, the reimplementation); this only notices change. If it fails, the
 * algorithm changed: keep the old one available under its id and give the new one a
 * new ENGINE_ID — do not update these values.
 */
import { describe, expect, it } from 'vitest';
import { buildManifest, type Spec } from '../../../lib/schedule/index';

// Copies of the shipped examples as they were when pinned: editing an example must not move the pin.
const PINNED: Record<string, Spec> = {
  'optical-ramp-sine': {"format": "pulseloom-spec/1", "envelope": [{"kind": "ramp", "durationS": 30, "fromHz": 2, "toHz": 12}, {"kind": "ramp", "durationS": 60, "fromHz": 12, "toHz": 12}, {"kind": "sine", "durationS": 90, "meanHz": 10, "depthHz": 8, "freqHz": 0.25, "phaseDeg": -90}], "ceilingHz": 25, "refractory": {"absoluteMs": 10, "recoveryMs": 0}, "caps": {"maxRateHz": 40, "window": {"seconds": 2, "maxPulses": 40}}, "pulse": {"widthMs": 8, "amplitude": 6.5, "unit": "mW"}, "trials": 12, "seed": "vole-hippocampus-cohort-B/day-3", "clockHz": 20000},
  'electrical-biphasic': {"format": "pulseloom-spec/1", "envelope": [{"kind": "sine", "durationS": 120, "meanHz": 40, "depthHz": 30, "freqHz": 0.1, "phaseDeg": 0}, {"kind": "ramp", "durationS": 60, "fromHz": 40, "toHz": 5}], "ceilingHz": 80, "refractory": {"absoluteMs": 4, "recoveryMs": 6}, "caps": {"window": {"seconds": 1, "maxPulses": 60}}, "pulse": {"widthMs": 0.45, "amplitude": 60, "unit": "uA", "phases": {"widthUs": 200, "gapUs": 50, "leading": "cathodic"}}, "trials": 8, "seed": "finch-HVC-microstim-2031", "clockHz": 30000},
};

describe('pulseloom-thinning/1 output is frozen', () => {
  it.each([
    ['optical-ramp-sine', 16_935, 'sha256:437ed352d25a645f5b310f4a02f5d73eaeec1f3b5556e938b2446b60b6a85482'],
    ['electrical-biphasic', 34_915, 'sha256:b5800426005c1af0ac4a0935eb98d0f7fb4fa2d8b9ed977749c1893cf20ea7a4'],
  ])('%s', (name, pulses, checksum) => {
    const m = buildManifest(PINNED[name]);
    expect(m.engineVersion).toBe('pulseloom-thinning/1');
    expect(m.pulseCount).toBe(pulses);
    expect(m.checksum).toBe(checksum);
  });
});
