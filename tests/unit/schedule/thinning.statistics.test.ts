/**
 * Statistical checks of the engine against published results and an outside statistics
 * library (jstat). Every test uses a fixed seed, so it is deterministic; the stated
 * false-failure rate is the chance that a correct engine fails the same check with a
 * seed picked at random.
 */
import { describe, expect, it } from 'vitest';
import { integrateEnvelope } from '../../../lib/schedule/envelope';
import { generateSchedule } from '../../../lib/schedule/generate';
import type { Segment, Spec } from '../../../lib/schedule/spec';
import { KS_LIMIT, intervals, jStat, ksStatistic, meanVar } from './helpers/reference';
import { baseSpec, holdSpec } from './helpers/specs';

const MHZ = 1_000_000; // 1 µs ticks: clock placement is far below every test's resolution.
/** Shortest refractory the schema allows with a 1 µs pulse; λτ ≤ 1e-4 here, invisible at these sample sizes. */
const NO_REFRACTORY = { absoluteMs: 0.001, recoveryMs: 0 };
const TINY_PULSE = { widthMs: 0.001, amplitude: 1, unit: 'mW' as const };

const onsets = (spec: Spec) => generateSchedule(spec).trials.map((t) => t.onsetsS);

describe('homogeneous case: counts are Poisson, intervals exponential', () => {
  const rate = 50;
  const T = 2000;
  const spec = holdSpec({ rateHz: rate, durationS: T, refractory: NO_REFRACTORY, pulse: TINY_PULSE, clockHz: MHZ, seed: 'homog-1' });
  const [t] = onsets(spec);

  it('counts in 1 s windows: mean = variance (dispersion test, χ² from jstat) and Fano ≈ 1 (Dayan & Abbott, Theoretical Neuroscience §1.4, recalled from memory, b)', () => {
    const counts = new Array<number>(T).fill(0);
    for (const x of t) counts[Math.floor(x)]++;
    const { mean, variance } = meanVar(counts);
    // Mean: normal approximation, 4.4 sd ⇒ false failure ≈ 1e-5.
    expect(Math.abs(mean - rate)).toBeLessThan(4.4 * Math.sqrt(rate / T));
    // Index of dispersion (n − 1)·s²/mean ~ χ²(n − 1) for Poisson counts; two-sided 0.1 % ⇒ false failure 0.1 %.
    const stat = ((T - 1) * variance) / mean;
    const p = jStat.chisquare.cdf(stat, T - 1);
    expect(p).toBeGreaterThan(0.0005);
    expect(p).toBeLessThan(0.9995);
    expect(variance / mean).toBeGreaterThan(0.85);
    expect(variance / mean).toBeLessThan(1.15);
  });

  it('intervals are Exp(rate): KS against jstat.exponential at the 99 % level (false failure 1 %)', () => {
    const iv = intervals(t);
    const d = ksStatistic(iv, (x) => jStat.exponential.cdf(x, rate));
    expect(d).toBeLessThan(KS_LIMIT[0.99] / Math.sqrt(iv.length));
  });
});

describe('thinning reproduces the nonhomogeneous Poisson process (Lewis & Shedler 1979)', () => {
  it('λ(t) = sin t + 4 with M = 5 on [0, 200]: E[N] = Var[N] = 800.5128 and acceptance 0.8005 (facts.md §1, computed, c)', () => {
    const env: Segment[] = [{ kind: 'sine', durationS: 200, meanHz: 4, depthHz: 1, freqHz: 1 / (2 * Math.PI), phaseDeg: 0 }];
    const trials = 400;
    const s = generateSchedule(baseSpec({ envelope: env, ceilingHz: 5, trials, refractory: NO_REFRACTORY, pulse: TINY_PULSE, seed: 'ls-worked' }));
    const counts = s.trials.map((t) => t.onsetsS.length);
    const { mean, variance } = meanVar(counts);
    const EN = 800.5128;
    // Mean of 400 counts, sd √(800.5/400) = 1.41; 4.4 sd ⇒ false failure ≈ 1e-5.
    expect(Math.abs(mean - EN)).toBeLessThan(4.4 * Math.sqrt(EN / trials));
    // Variance: (n − 1)s²/σ² ~ χ²(n − 1) (counts ≈ normal at this mean); 0.1 % two-sided band from jstat.
    const lo = (jStat.chisquare.inv(0.0005, trials - 1) * EN) / (trials - 1);
    const hi = (jStat.chisquare.inv(0.9995, trials - 1) * EN) / (trials - 1);
    expect(variance).toBeGreaterThan(lo);
    expect(variance).toBeLessThan(hi);
    // Acceptance = ∫λ / (M·T): kept / candidates, pooled over 320 000 candidates (sd ≈ 0.0007; 0.003 is > 4 sd).
    const cand = s.stats.perTrial.reduce((a, t) => a + t.candidates, 0);
    expect(s.stats.realizedCount.total / cand).toBeCloseTo(0.8005, 2);
    expect(Math.abs(s.stats.realizedCount.total / cand - 0.8005)).toBeLessThan(0.003);
  });

  it('mean over many trials: the binned rate across trials matches ρ(t) within a Poisson band (jstat) and a χ² goodness of fit', () => {
    const env: Segment[] = [
      { kind: 'ramp', durationS: 5, fromHz: 2, toHz: 30 },
      { kind: 'sine', durationS: 10, meanHz: 20, depthHz: 15, freqHz: 0.3, phaseDeg: 45 },
      { kind: 'ramp', durationS: 5, fromHz: 8, toHz: 8 },
    ];
    const trials = 300;
    const spec = baseSpec({ envelope: env, ceilingHz: 40, trials, refractory: NO_REFRACTORY, pulse: TINY_PULSE, seed: 'psth' });
    const all = onsets(spec).flat();
    const bins = 40;
    const w = 20 / bins;
    const obs = new Array<number>(bins).fill(0);
    for (const x of all) obs[Math.min(bins - 1, Math.floor(x / w))]++;
    let chi2 = 0;
    const perBin = 0.001 / bins; // Bonferroni: family-wise false failure ≤ 0.1 %.
    for (let b = 0; b < bins; b++) {
      const expected = trials * integrateEnvelope(env, b * w, (b + 1) * w);
      chi2 += (obs[b] - expected) ** 2 / expected;
      const lower = poissonQuantile(perBin / 2, expected);
      const upper = poissonQuantile(1 - perBin / 2, expected);
      expect(obs[b], `bin ${b}`).toBeGreaterThanOrEqual(lower);
      expect(obs[b], `bin ${b}`).toBeLessThanOrEqual(upper);
    }
    // Pearson χ² with `bins` degrees of freedom (expected counts fixed in advance); false failure 0.1 %.
    expect(1 - jStat.chisquare.cdf(chi2, bins)).toBeGreaterThan(0.001);
  });
});

describe('dead time: non-paralyzable counter (Knoll, Radiation Detection and Measurement, 4th ed., ch. 4; recalled, b)', () => {
  const cases = [
    // facts.md §3 check values (computed, c): λ, τ ⇒ ν, CV, Fano∞ = CV² (Cox 1962, recalled, b).
    { lambda: 100, tauMs: 10, nu: 50, cv: 0.5 },
    { lambda: 50, tauMs: 5, nu: 40, cv: 0.8 },
  ];
  for (const c of cases) {
    it(`λ ${c.lambda} Hz, τ ${c.tauMs} ms ⇒ kept rate λ/(1+λτ) = ${c.nu} Hz, interval CV 1/(1+λτ) = ${c.cv}, shifted-exponential intervals`, () => {
      const T = 2000;
      const spec = holdSpec({ rateHz: c.lambda, durationS: T, refractory: { absoluteMs: c.tauMs, recoveryMs: 0 }, clockHz: MHZ, seed: `dead-${c.lambda}` });
      const s = generateSchedule(spec);
      const t = s.trials[0].onsetsS;
      const rate = t.length / T;
      // Renewal count: Var N ≈ N·CV²; 4.4 sd ⇒ false failure ≈ 1e-5.
      const sd = Math.sqrt(c.nu * T * c.cv ** 2) / T;
      expect(Math.abs(rate - c.nu)).toBeLessThan(4.4 * sd);
      // The paralyzable rate λe^(−λτ) (facts.md §3; the bug of measuring from the last candidate) lies > 8 sd away.
      expect(Math.abs(rate - c.lambda * Math.exp((-c.lambda * c.tauMs) / 1000))).toBeGreaterThan(4.4 * sd);
      const iv = intervals(t);
      const { mean, variance } = meanVar(iv);
      // se(CV) ≈ CV·√((κ − 1)/4n) with kurtosis κ = 9 for the exponential part: ≤ 0.003 here; 0.015 > 4.4 se.
      expect(Math.abs(Math.sqrt(variance) / mean - c.cv)).toBeLessThan(0.015);
      // Interval density λe^(−λ(Δ−τ)) for Δ ≥ τ (facts.md §3, a): KS at 99 % with jstat's exponential (false failure 1 %).
      const tau = c.tauMs / 1000;
      expect(Math.min(...iv)).toBeGreaterThanOrEqual(tau - 1e-12);
      const d = ksStatistic(iv, (x) => jStat.exponential.cdf(x - tau, c.lambda));
      expect(d).toBeLessThan(KS_LIMIT[0.99] / Math.sqrt(iv.length));
      // The engine's own prediction is the same formula (clock half-tick aside).
      expect(s.stats.expectedDeliveredCount / T).toBeCloseTo(c.nu, 1);
    });
  }

  it('long-window Fano factor of the dead-time train tends to CV² = 0.25 (Cox 1962, recalled, b), not 1', () => {
    const T = 2000;
    const spec = holdSpec({ rateHz: 100, durationS: T, refractory: { absoluteMs: 10, recoveryMs: 0 }, clockHz: MHZ, seed: 'fano' });
    const t = onsets(spec)[0];
    const win = 10;
    const counts = new Array<number>(T / win).fill(0);
    for (const x of t) counts[Math.floor(x / win)]++;
    const { mean, variance } = meanVar(counts);
    // 200 windows: se of a variance ratio ≈ √(2/199) ≈ 10 %; the band 0.25 ± 0.12 is > 4 se, and far from Poisson's 1.
    expect(variance / mean).toBeGreaterThan(0.13);
    expect(variance / mean).toBeLessThan(0.37);
  });
});

describe('time-rescaling theorem (Brown, Barbieri, Ventura, Kass & Frank 2002, Neural Computation 14:325–346)', () => {
  const env: Segment[] = [{ kind: 'sine', durationS: 150, meanHz: 35, depthHz: 30, freqHz: 0.4, phaseDeg: 0 }];
  const tau = 0.01;
  const rho = (t: number) => 35 + 30 * Math.sin(2 * Math.PI * 0.4 * t);
  const Lam = (a: number, b: number) => integrateEnvelope(env, a, b);

  /** Rescaled intervals τ_k = ∫ λ(s | H_s) ds between events; the first from 0 with no history. */
  function rescaled(trains: number[][], lambdaStar: (last: number, a: number, b: number) => number) {
    const out: number[] = [];
    for (const t of trains) {
      let last = -Infinity;
      let prev = 0;
      for (const x of t) {
        out.push(lambdaStar(last, prev, x));
        last = x;
        prev = x;
      }
    }
    return out;
  }

  function ksAgainstExp1(taus: number[]) {
    return ksStatistic(taus, (x) => jStat.exponential.cdf(x, 1)) * Math.sqrt(taus.length);
  }

  it('absolute refractory: intervals rescaled by λ(t)·1{t − t_last ≥ τ} are Exp(1) (KS at 99 %, false failure 1 %); the uncapped Λ is rejected', () => {
    const spec = baseSpec({ envelope: env, ceilingHz: 65, trials: 6, refractory: { absoluteMs: tau * 1000, recoveryMs: 0 }, clockHz: MHZ, seed: 'rescale-abs' });
    const trains = onsets(spec);
    // With refractoriness the integral starts at t_(k−1) + τ (facts.md §2, c).
    const right = rescaled(trains, (last, a, b) => (last === -Infinity ? Lam(a, b) : Lam(Math.min(a + tau, b), b)));
    expect(right.length).toBeGreaterThan(10_000);
    expect(ksAgainstExp1(right)).toBeLessThan(KS_LIMIT[0.99]);
    // Independence (same paper): lag-1 autocorrelation of the Gaussianized z within ± z₀.₉₉₅/√n (false failure 1 %).
    const g = right.map((x) => jStat.normal.inv(Math.min(1 - 1e-12, jStat.exponential.cdf(x, 1)), 0, 1));
    const r1 = lag1(g);
    expect(Math.abs(r1)).toBeLessThan(jStat.normal.inv(0.995, 0, 1) / Math.sqrt(g.length));
    // Deliberately wrong intensity: ignore refractoriness (λτ up to 0.65 here) ⇒ must fail the same test.
    const wrong = rescaled(trains, (_last, a, b) => Lam(a, b));
    expect(ksAgainstExp1(wrong)).toBeGreaterThan(KS_LIMIT[0.99]);
  });

  it('exponential recovery: intervals rescaled by λ(t)·h(t − t_last), h = 1 − e^(−(Δ−τ)/r), are Exp(1) (KS 99 %); h ≡ 1 after τ is rejected', () => {
    const r = 0.015;
    const spec = baseSpec({ envelope: env, ceilingHz: 65, trials: 5, refractory: { absoluteMs: tau * 1000, recoveryMs: r * 1000 }, clockHz: MHZ, seed: 'rescale-rec' });
    const trains = onsets(spec);
    const withRecovery = (last: number, a: number, b: number) =>
      last === -Infinity ? Lam(a, b) : simpson((s) => rho(s) * (1 - Math.exp(-(s - last - tau) / r)), Math.min(last + tau, b), b);
    const right = rescaled(trains, withRecovery);
    expect(ksAgainstExp1(right)).toBeLessThan(KS_LIMIT[0.99]);
    const absOnly = rescaled(trains, (last, a, b) => (last === -Infinity ? Lam(a, b) : Lam(Math.min(a + tau, b), b)));
    expect(ksAgainstExp1(absOnly)).toBeGreaterThan(KS_LIMIT[0.99]);
  });
});

describe('expected delivered count for a changing envelope (quasi-static estimate, c)', () => {
  it('is within 2 % of the realized mean when ρ changes slowly against τ', () => {
    const env: Segment[] = [
      { kind: 'ramp', durationS: 60, fromHz: 10, toHz: 80 },
      { kind: 'sine', durationS: 60, meanHz: 50, depthHz: 30, freqHz: 0.05, phaseDeg: 0 },
    ];
    const s = generateSchedule(baseSpec({ envelope: env, ceilingHz: 80, trials: 40, refractory: { absoluteMs: 8, recoveryMs: 0 }, clockHz: 20_000, seed: 'quasi' }));
    // Realized mean over 40 trials has sd ≈ √(5000·0.6/40)/5000 < 0.2 %: the 2 % band is > 10 sd
    // (false failure ≈ 0) and measures the quasi-static approximation, not chance.
    expect(Math.abs(s.stats.realizedCount.meanPerTrial / s.stats.expectedDeliveredCount - 1)).toBeLessThan(0.02);
    expect(s.stats.expectedCount).toBeCloseTo(integrateEnvelope(env, 0, 120), 9);
  });
});

function lag1(x: number[]): number {
  const { mean, variance } = meanVar(x);
  let s = 0;
  for (let i = 1; i < x.length; i++) s += (x[i] - mean) * (x[i - 1] - mean);
  return s / ((x.length - 1) * variance);
}

function simpson(f: (x: number) => number, a: number, b: number): number {
  if (!(b > a)) return 0;
  const n = 200;
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let k = 1; k < n; k++) s += (k % 2 ? 4 : 2) * f(a + k * h);
  return (s * h) / 3;
}

/**
 * Smallest k with P(X ≤ k) ≥ p for X ~ Poisson(mean). jstat's poisson.cdf returns NaN
 * for counts in the hundreds, so the CDF goes through the standard identity
 * P(X ≤ k) = 1 − F_χ²(2·mean; 2k + 2), with jstat's χ² CDF.
 */
function poissonQuantile(p: number, mean: number): number {
  const cdf = (k: number) => 1 - jStat.chisquare.cdf(2 * mean, 2 * k + 2);
  let k = Math.max(0, Math.floor(mean - 10 * Math.sqrt(mean)));
  while (cdf(k) < p) k++;
  return k;
}
