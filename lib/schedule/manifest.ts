/**
 * The manifest: everything needed to regenerate a schedule anywhere and to prove a
 * file is what the spec produces. It holds no dates, hostnames or release numbers,
 * so the same spec gives the same manifest bytes on every machine.
 */
import { canonicalSpec, canonicalSpecJson } from './canonical';
import { CHECKSUM_OF, ChecksumWriter, sha256Text } from './checksum';
import { compileSpec } from './compile';
import { ENGINE_ID, ENGINE_METHOD, ENGINE_RANDOMNESS } from './engine';
import type { Spec } from './spec';
import { summarize, trialStats, type ScheduleStats, type TrialStats } from './stats';
import { runTrial } from './stream';
import { assertValid } from './validate';

export const MANIFEST_FORMAT = 'pulseloom-manifest/1';

export interface Manifest {
  format: typeof MANIFEST_FORMAT;
  /** Algorithm id; output depends on it and on the spec, nothing else. */
  engineVersion: string;
  spec: Spec;
  /** sha256 of the canonical spec JSON (UTF-8), as `sha256:<hex>`. */
  specSha256: string;
  rng: string;
  seedDerivation: string;
  blockSeconds: number;
  method: typeof ENGINE_METHOD;
  pulseCount: number;
  checksum: string;
  checksumOf: string;
}

export interface ScanResult {
  checksum: string;
  pulseCount: number;
  stats: ScheduleStats;
}

/** One pass over every trial without keeping pulses: checksum, count, statistics. */
export function scanSchedule(spec: Spec): ScanResult {
  assertValid(spec);
  const c = compileSpec(spec);
  const sum = new ChecksumWriter();
  const perTrial: TrialStats[] = [];
  let pulseCount = 0;
  for (let trial = 0; trial < spec.trials; trial++) {
    const counts = runTrial(c, trial, (samples, n) => sum.add(trial, samples, n));
    pulseCount += counts.kept;
    perTrial.push(trialStats(c, trial, counts));
  }
  return { checksum: sum.digest(), pulseCount, stats: summarize(c, perTrial) };
}

export function buildManifest(spec: Spec, scanned?: Pick<ScanResult, 'checksum' | 'pulseCount'>): Manifest {
  const { checksum, pulseCount } = scanned ?? scanSchedule(spec);
  return {
    format: MANIFEST_FORMAT,
    engineVersion: ENGINE_ID,
    spec: canonicalSpec(spec),
    specSha256: sha256Text(canonicalSpecJson(spec)),
    rng: ENGINE_RANDOMNESS.rng,
    seedDerivation: ENGINE_RANDOMNESS.seedDerivation,
    blockSeconds: ENGINE_RANDOMNESS.blockSeconds,
    method: ENGINE_METHOD,
    pulseCount,
    checksum,
    checksumOf: CHECKSUM_OF,
  };
}
