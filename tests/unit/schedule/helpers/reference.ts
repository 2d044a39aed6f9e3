/**
 * Outside references for the engine's statistical tests.
 *
 * Distributions come from jstat (npm, general-purpose statistics library); jstat ships
 * no type declarations, so it is loaded untyped behind this small typed facade.
 * KS critical values are the limiting Kolmogorov quantiles listed in
 * /work/shared/facts.md §2 (computed values, tag c), not derived here.
 */
import { createRequire } from 'node:module';

interface JStat {
  exponential: { cdf(x: number, rate: number): number };
  poisson: { cdf(k: number, l: number): number; pdf(k: number, l: number): number };
  chisquare: { cdf(x: number, dof: number): number; inv(p: number, dof: number): number };
  normal: { inv(p: number, mean: number, sd: number): number; cdf(x: number, mean: number, sd: number): number };
  uniform: { cdf(x: number, a: number, b: number): number };
}

export const jStat = createRequire(import.meta.url)('jstat') as JStat;

/** Limiting Kolmogorov quantiles (facts.md §2, computed, tag c): P(√n·D > k) = 1 − level. */
export const KS_LIMIT = { 0.9: 1.2238, 0.95: 1.3581, 0.99: 1.6276 } as const;

/** One-sample KS statistic D = sup |F_n(x) − F(x)| against a continuous CDF. */
export function ksStatistic(values: number[], cdf: (x: number) => number): number {
  const x = [...values].sort((a, b) => a - b);
  const n = x.length;
  let d = 0;
  for (let i = 0; i < n; i++) {
    const f = cdf(x[i]);
    d = Math.max(d, f - i / n, (i + 1) / n - f);
  }
  return d;
}

/** Mean and sample variance. */
export function meanVar(xs: number[]): { mean: number; variance: number } {
  const n = xs.length;
  const mean = xs.reduce((a, b) => a + b, 0) / n;
  const variance = xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1);
  return { mean, variance };
}

export function intervals(onsets: number[]): number[] {
  const out: number[] = [];
  for (let i = 1; i < onsets.length; i++) out.push(onsets[i] - onsets[i - 1]);
  return out;
}
