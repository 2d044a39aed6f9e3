/**
 * Exports of a schedule whose checksum and pulse count are already known (stored when
 * the version was submitted): one pass, same bytes, and a stream that disagrees with
 * the stored values never completes.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ScheduleMismatchError, csvBytes, jsonBytes, scanSchedule, type Spec } from '../../../lib/schedule/index';

const example = (name: string): Spec =>
  JSON.parse(readFileSync(new URL(`../../../lib/schedule/examples/${name}.json`, import.meta.url), 'utf8')) as Spec;
const meta = { protocol: 'otter-barrel-map', version: 2, approvedBy: 'N. Hale', status: 'approved', channel: 'AO1' };
const text = (chunks: Iterable<Uint8Array>) => Buffer.concat([...chunks]).toString('utf8');

describe.each([
  ['CSV', csvBytes],
  ['JSON', jsonBytes],
] as const)('%s export with a known checksum', (_name, write) => {
  for (const name of ['optical-ramp-sine', 'electrical-biphasic']) {
    const spec = example(name);
    const { checksum, pulseCount } = scanSchedule(spec);

    it(`${name}: is byte-identical to the two-pass export`, () => {
      expect(text(write(spec, meta, { known: { checksum, pulseCount } }))).toBe(text(write(spec, meta)));
    });

    it(`${name}: throws before the last chunk when the stored checksum or count differs`, () => {
      const full = [...write(spec, meta)];
      for (const known of [
        { checksum: `sha256:${'0'.repeat(64)}`, pulseCount },
        { checksum, pulseCount: pulseCount + 1 },
      ]) {
        const got: Uint8Array[] = [];
        let error: unknown;
        try {
          for (const chunk of write(spec, meta, { known })) got.push(chunk);
        } catch (e) {
          error = e;
        }
        expect(error).toBeInstanceOf(ScheduleMismatchError);
        expect((error as ScheduleMismatchError).actual).toEqual({ checksum, pulseCount });
        // What went out lacks the file's last chunk (the final rows, or the JSON's closing stats).
        const sent = text(got);
        expect(sent.length).toBeLessThan(text(full).length);
        expect(sent.endsWith(text([full.at(-1)!]))).toBe(false);
      }
    });
  }
});
