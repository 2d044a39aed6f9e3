/**
 * 95 % interval for a Poisson mean from one observed count k.
 *
 * Small counts (k ≤ 30) get the exact (Garwood) limits, found by bisection on the
 * Poisson distribution function: the lower limit μ_L solves P(N ≥ k; μ_L) = 0.025, the
 * upper μ_U solves P(N ≤ k; μ_U) = 0.025. Larger counts use Byar's approximation,
 *   lower = k·(1 − 1/(9k) − z/(3√k))³,  upper = (k+1)·(1 − 1/(9(k+1)) + z/(3√(k+1)))³,
 * already within 0.05 % of the exact limits there. Closed form or a short loop, so the
 * preview needs no statistics package at run time.
 */
const Z = 1.959963984540054;
const TAIL = 0.025;
const EXACT_UP_TO = 30;

export function poissonInterval95(k: number): { lower: number; upper: number } {
  if (!(k > 0)) return { lower: 0, upper: -Math.log(TAIL) };
  if (k <= EXACT_UP_TO && Number.isInteger(k)) {
    return {
      lower: solveMonotone((mu) => 1 - poissonCdf(k - 1, mu), TAIL, k, true),
      upper: solveMonotone((mu) => poissonCdf(k, mu), TAIL, k, false),
    };
  }
  const lower = k * (1 - 1 / (9 * k) - Z / (3 * Math.sqrt(k))) ** 3;
  const k1 = k + 1;
  const upper = k1 * (1 - 1 / (9 * k1) + Z / (3 * Math.sqrt(k1))) ** 3;
  return { lower: Math.max(0, lower), upper };
}

/** P(N ≤ k) for N ~ Poisson(mu), summed term by term (k is small here). */
function poissonCdf(k: number, mu: number): number {
  let term = Math.exp(-mu);
  let sum = term;
  for (let i = 1; i <= k; i++) {
    term *= mu / i;
    sum += term;
  }
  return sum;
}

/**
 * μ where f(μ) = target, f monotone: increasing in μ for the lower limit (searched in
 * [0, k]), decreasing for the upper (searched in [k, k + 10√k + 10]).
 */
function solveMonotone(f: (mu: number) => number, target: number, k: number, increasing: boolean): number {
  let lo = increasing ? 0 : k;
  let hi = increasing ? k : k + 10 * Math.sqrt(k) + 10;
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    const above = f(mid) > target;
    if (above === increasing) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}
