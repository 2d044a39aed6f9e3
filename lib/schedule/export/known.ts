/**
 * Exports of a schedule whose checksum and pulse count are already known (stored when
 * the version was submitted): the writers take them instead of a counting pass and
 * check the pulses against them on the way.
 */
import { ChecksumWriter } from '../checksum';
/**
 * What the caller already knows about the schedule, e.g. stored when the version was
 * submitted. With it the writers need no counting pass: they write the header from these
 * values, check every pulse against them as they go, and throw ScheduleMismatchError
 * before the last chunk if the pulses differ, so a stream that disagrees never completes.
 */
export interface KnownSchedule {
  checksum: string;
  pulseCount: number;
}

export interface ExportOptions {
  known?: KnownSchedule;
}

export class ScheduleMismatchError extends Error {
  constructor(
    readonly expected: KnownSchedule,
    readonly actual: KnownSchedule,
  ) {
    super(
      `the regenerated schedule differs from the stored one: ${actual.pulseCount} pulses, ${actual.checksum}; expected ${expected.pulseCount} pulses, ${expected.checksum}`,
    );
    this.name = 'ScheduleMismatchError';
  }
}

/** Gathers the checksum and count of the pulses as they are written, then compares. */
export class KnownScheduleCheck {
  private readonly sum = new ChecksumWriter();
  private pulseCount = 0;

  constructor(readonly expected: KnownSchedule) {}

  add(trial: number, samples: Float64Array, length: number): void {
    this.sum.add(trial, samples, length);
    this.pulseCount += length;
  }

  /** `count` pulses given as their checksum lines, `<trial>,<onsetSample>\n` each. */
  addLines(lines: Uint8Array, count: number): void {
    this.sum.addLines(lines);
    this.pulseCount += count;
  }

  /** Throws ScheduleMismatchError unless every pulse so far matches the known values. */
  verify(): void {
    const actual = { checksum: this.sum.digest(), pulseCount: this.pulseCount };
    if (actual.checksum !== this.expected.checksum || actual.pulseCount !== this.expected.pulseCount) {
      throw new ScheduleMismatchError(this.expected, actual);
    }
  }
}
