/**
 * Engine identity. The id names the algorithm that turns a spec into pulses; it
 * changes only when output for some spec would change, and the old algorithm stays
 * available under its id so old manifests still verify. It is the "engine version"
 * in the manifest on purpose: a release number would make identical schedules differ
 * byte for byte between releases.
 */
import { BLOCK_SECONDS, RNG_ALGORITHM, SEED_DERIVATION } from './seeds';

export const ENGINE_ID = 'pulseloom-thinning/1';

export const SUPPORTED_ENGINES: readonly string[] = [ENGINE_ID];

/** The method, in words, recorded in every manifest so a reader can reimplement it. */
export const ENGINE_METHOD = {
  cloud:
    'per (trial, block b): K = max(1, ceil(60·ceilingHz/4)) cells of L = 60/K s; cell j starts at cs = 60·b + j·L (stop at the first cs >= min(60·(b+1), durationS)); ' +
    'u -> count n = smallest k with u < F[k], F the Poisson(mu = ceilingHz·L) CDF built as p0 = exp(-mu), pk = p(k-1)·mu/k, Fk = F(k-1) + pk, stopping at the first k > mu where adding pk leaves F unchanged (or k = 1000), then a final entry 1; ' +
    'then n pairs of draws: u -> position t = cs + u·L, u -> height y = u·ceilingHz; pairs with t >= min(60·(b+1), durationS) are dropped; the thinning rule is applied to each pair in draw order; the pairs that pass are sorted by t (ascending, stable) and go through the other rules in that order',
  envelope:
    'rho(t) on the segment holding t, local = t - segmentStart: ramp fromHz + (toHz - fromHz)·(local / durationS); sine meanHz + depthHz·sin(2π·freqHz·local + phaseDeg·π/180)',
  rules: [
    'thinning: keep only if y < rho(t) (applied before sorting, as it needs no history)',
    'refractory: d = t - lastSample/clockHz; reject if d < absoluteMs/1000, or recoveryMs > 0 and y >= rho(t)·(1 - exp(-(d - absoluteMs/1000)/(recoveryMs/1000)))',
    'clock: s = floor(t·clockHz) (at most the trial/block end - 1); reject if s - lastSample < max(1, ceil(absoluteMs·clockHz/1000 - 1e-9))',
    'maxRate: reject if s - lastSample < ceil(clockHz/maxRateHz - 1e-9)',
    'window: reject if maxPulses pulses already lie in (s - ceil(seconds·clockHz - 1e-9), s]',
    'otherwise keep s; state (last kept sample, recent kept samples) carries across blocks of a trial and resets per trial',
  ],
  onsetS: 'onsetSample / clockHz (IEEE-754 double)',
} as const;

export const ENGINE_RANDOMNESS = {
  rng: RNG_ALGORITHM,
  seedDerivation: SEED_DERIVATION,
  blockSeconds: BLOCK_SECONDS,
} as const;
