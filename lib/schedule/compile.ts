/**
 * A validated spec turned into flat numbers the sweep reads without allocating:
 * segment coefficients in typed arrays and every time rule converted to clock ticks.
 */
import { segmentStarts } from './envelope';
import { BLOCK_SECONDS } from './seeds';
import type { Spec } from './spec';

const TWO_PI = 2 * Math.PI;
const DEG = Math.PI / 180;

/**
 * Durations in ticks, rounded up. The 1e-9 slack keeps decimal inputs like
 * 0.1 ms × 30 000 Hz (3.0000000000000004 in binary) at the whole tick they mean.
 */
export function ceilTicks(seconds: number, clockHz: number): number {
  return Math.ceil(seconds * clockHz - 1e-9);
}

/** Mean candidates per cell, at most: small cells sort fast and keep envelope bounds tight. */
export const CELL_MEAN = 4;

/**
 * Poisson(μ) CDF: F[k] = P(N ≤ k), built by p₀ = e^(−μ), p_k = p_(k−1)·μ/k, F[k] = F[k−1] + p_k,
 * until F stops changing; then a final 1 takes the remaining mass (below 1e-16).
 */
export function poissonCdf(mu: number): Float64Array {
  const F: number[] = [];
  let p = Math.exp(-mu);
  let acc = p;
  F.push(acc);
  for (let k = 1; k < 1000; k++) {
    p = (p * mu) / k;
    const next = acc + p;
    if (next === acc && k > mu) break;
    acc = next;
    F.push(acc);
  }
  F.push(1);
  return Float64Array.from(F);
}

export interface Compiled {
  spec: Spec;
  durationS: number;
  ceilingHz: number;
  clockHz: number;
  nSegments: number;
  starts: Float64Array;
  /** 0 ramp, 1 sine */
  kind: Uint8Array;
  /** ramp: fromHz, diffHz, durationS; sine: meanHz, depthHz, ω (rad/s), φ (rad) */
  c0: Float64Array;
  c1: Float64Array;
  c2: Float64Array;
  c3: Float64Array;
  absoluteS: number;
  recoveryS: number;
  /** Minimum ticks between kept onsets from refractoriness (≥ 1: never two pulses on one tick). */
  refractoryTicks: number;
  /** Minimum ticks between kept onsets from caps.maxRateHz (0 = no cap). */
  maxRateTicks: number;
  /** Window cap: among any windowMax + 1 consecutive kept pulses, first to last ≥ windowTicks. 0 = none. */
  windowTicks: number;
  windowMax: number;
  nBlocks: number;
  /** Each 60 s block is cut into this many equal cells; each cell gets a Poisson count of candidates. */
  cellsPerBlock: number;
  cellS: number;
  /** Poisson(ceilingHz · cellS) CDF for inversion; the last entry is 1. */
  cellCdf: Float64Array;
  /** cellGuide[k] = first n with cellCdf[n] > k / GUIDE_SIZE: where the inversion search may start for u ≥ k / GUIDE_SIZE. */
  cellGuide: Int32Array;
  /** Per segment: how many consecutive cells share one [lo, hi] bound of ρ (see spanCellsFor). */
  spanCells: Int32Array;
  /** Rounding allowance added around segment bounds so the shortcut never disagrees with ρ(t). */
  pad: Float64Array;
  /** Exclusive upper sample bound of the trial: every onsetSample < this. */
  endSample: number;
}

export function compileSpec(spec: Spec): Compiled {
  const env = spec.envelope;
  const n = env.length;
  const starts = segmentStarts(env);
  const kind = new Uint8Array(n);
  const c0 = new Float64Array(n);
  const c1 = new Float64Array(n);
  const c2 = new Float64Array(n);
  const c3 = new Float64Array(n);
  env.forEach((seg, i) => {
    if (seg.kind === 'ramp') {
      kind[i] = 0;
      c0[i] = seg.fromHz;
      c1[i] = seg.toHz - seg.fromHz;
      c2[i] = seg.durationS;
    } else {
      kind[i] = 1;
      c0[i] = seg.meanHz;
      c1[i] = seg.depthHz;
      c2[i] = TWO_PI * seg.freqHz;
      c3[i] = seg.phaseDeg * DEG;
    }
  });
  const clockHz = spec.clockHz;
  const durationS = starts[n];
  const window = spec.caps?.window;
  let windowTicks = 0;
  let windowMax = 0;
  const refractoryTicks = Math.max(1, ceilTicks(spec.refractory.absoluteMs / 1000, clockHz));
  if (window) {
    windowTicks = ceilTicks(window.seconds, clockHz);
    // Most pulses that fit in a window given the refractory spacing: a cap at or above
    // it can never bind, so skip it rather than keep a ring buffer for nothing.
    const fit = Math.floor((windowTicks - 1) / refractoryTicks) + 1;
    if (window.maxPulses < fit) windowMax = window.maxPulses;
    else windowTicks = 0;
  }
  const maxRate = spec.caps?.maxRateHz;
  const cellsPerBlock = Math.max(1, Math.ceil((BLOCK_SECONDS * spec.ceilingHz) / CELL_MEAN));
  const cellS = BLOCK_SECONDS / cellsPerBlock;
  const pad = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    pad[i] = 1e-12 * (Math.abs(c0[i]) + Math.abs(c1[i]) + 1);
    if (kind[i] === 1) {
      // The cell bounds use a fast sine (sweep.ts boundSin): error ≤ 1e-9 + 1e-15·|θ|; pad 10× that.
      const thetaMax = Math.abs(c2[i] * (starts[i + 1] - starts[i])) + Math.abs(c3[i]);
      pad[i] += 10 * Math.abs(c1[i]) * (1e-9 + 1e-15 * thetaMax);
    }
  }
  const cellCdf = poissonCdf(spec.ceilingHz * cellS);
  const spanCells = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const slope = kind[i] === 0 ? Math.abs(c1[i] / c2[i]) : Math.abs(c1[i] * c2[i]);
    spanCells[i] = spanCellsFor(slope, cellS, spec.ceilingHz);
  }
  return {
    spec,
    durationS,
    ceilingHz: spec.ceilingHz,
    clockHz,
    nSegments: n,
    starts,
    kind,
    c0,
    c1,
    c2,
    c3,
    absoluteS: spec.refractory.absoluteMs / 1000,
    recoveryS: spec.refractory.recoveryMs / 1000,
    refractoryTicks,
    maxRateTicks: maxRate ? ceilTicks(1 / maxRate, clockHz) : 0,
    windowTicks,
    windowMax,
    nBlocks: Math.ceil(durationS / BLOCK_SECONDS),
    cellsPerBlock,
    cellS,
    cellCdf,
    cellGuide: guideTable(cellCdf),
    spanCells,
    pad,
    endSample: Math.ceil(durationS * clockHz),
  };
}

export const GUIDE_SIZE = 256;

/** Start points for Poisson inversion: the search result is unchanged, it just skips the first steps. */
export function guideTable(cdf: Float64Array): Int32Array {
  const g = new Int32Array(GUIDE_SIZE);
  let n = 0;
  for (let k = 0; k < GUIDE_SIZE; k++) {
    while (cdf[n] <= k / GUIDE_SIZE) n++;
    g[k] = n;
  }
  return g;
}

/**
 * Cells per bound span. A bound costs about one sine; a wider span makes the band
 * [lo, hi) wider, and each height inside it costs an exact ρ(t). With slope s (Hz/s)
 * the band of one cell is ≈ s·cellS wide out of ceilingHz, and about CELL_MEAN
 * candidates share a cell, so the cost per candidate ≈ 1/(CELL_MEAN·G) + G·s·cellS/ceilingHz
 * is least near G = √(ceilingHz / (CELL_MEAN·s·cellS)). Only speed depends on G: every
 * decision is still "y < ρ(t)".
 */
export function spanCellsFor(slope: number, cellS: number, ceilingHz: number): number {
  const band = slope * cellS;
  if (!(band > 0)) return 64;
  return Math.max(1, Math.min(64, Math.round(Math.sqrt(ceilingHz / (CELL_MEAN * band)))));
}
