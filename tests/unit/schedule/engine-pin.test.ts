/**
 * Regression pin, not a correctness oracle: the promise is that a spec read as
 * pulseloom-spec/1 and run by engine pulseloom-thinning/1 gives the same pulses on any
 * machine and in every later release. Correctness is tested elsewhere (statistics,
 * properties, the reimplementation); this only notices change. If it fails, the
 * algorithm changed: keep the old one available under its id and give the new one a
 * new ENGINE_ID — do not update these values.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildManifest, type Spec } from '../../../lib/schedule/index';

const example = (name: string): Spec =>
  JSON.parse(readFileSync(new URL(`../../../lib/schedule/examples/${name}.json`, import.meta.url), 'utf8')) as Spec;

describe('pulseloom-thinning/1 output is frozen', () => {
  it.each([
    ['optical-ramp-sine', 16_855, 'sha256:8bd2512b941ed2dff34c150854552e0ff86fe00b325d856a3e1f6aa8547fa012'],
    ['electrical-biphasic', 34_948, 'sha256:bbadc44bb73e1263006fd8f64f84898e5b581b03322e27e67f2c7bd4c727c9ca'],
  ])('%s', (name, pulses, checksum) => {
    const m = buildManifest(example(name));
    expect(m.engineVersion).toBe('pulseloom-thinning/1');
    expect(m.pulseCount).toBe(pulses);
    expect(m.checksum).toBe(checksum);
  });
});
