/**
 * The whole schedule in memory: per trial, onsets in seconds and in clock samples,
 * plus statistics and the manifest. For long exports use the streaming writers.
 */
import { ChecksumWriter } from './checksum';
import { compileSpec } from './compile';
import { buildManifest, type Manifest } from './manifest';
import type { Spec } from './spec';
import { summarize, trialStats, type ScheduleStats, type TrialStats } from './stats';
import { runTrial } from './stream';
import { assertValid } from './validate';

export interface TrialSchedule {
  trial: number;
  onsetsS: number[];
  onsetSamples: number[];
  stats: TrialStats;
}

export interface Schedule {
  manifest: Manifest;
  trials: TrialSchedule[];
  stats: ScheduleStats;
}

export function generateSchedule(spec: Spec): Schedule {
  assertValid(spec);
  const c = compileSpec(spec);
  const sum = new ChecksumWriter();
  const trials: TrialSchedule[] = [];
  let pulseCount = 0;
  for (let trial = 0; trial < spec.trials; trial++) {
    const onsetSamples: number[] = [];
    const counts = runTrial(c, trial, (samples, n) => {
      for (let i = 0; i < n; i++) onsetSamples.push(samples[i]);
    });
    sum.add(trial, onsetSamples);
    pulseCount += counts.kept;
    trials.push({ trial, onsetsS: onsetSamples.map((s) => s / c.clockHz), onsetSamples, stats: trialStats(c, trial, counts) });
  }
  const stats = summarize(
    c,
    trials.map((t) => t.stats),
  );
  return { manifest: buildManifest(spec, { checksum: sum.digest(), pulseCount }), trials, stats };
}
