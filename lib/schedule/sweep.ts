/**
 * The thinning sweep over one 60 s block of one trial (engine `pulseloom-thinning/1`).
 *
 * Candidates: a homogeneous Poisson cloud of rate ceilingHz on the block. The block is
 * cut into K equal cells (K = max(1, ⌈60·ceilingHz/4⌉)); each cell draws its count from
 * Poisson(ceilingHz·60/K) by inversion, then per candidate a uniform position and a
 * height y = u·ceilingHz. Independent Poisson counts with uniform positions in disjoint
 * cells are a homogeneous Poisson process, and this form needs no logarithm per
 * candidate. The thinning rule needs no history, so it runs in draw order and only the
 * survivors are sorted into time order for the rules that look back. The cloud depends
 * on (seed, trial, block, ceilingHz) only — never on the envelope or the duration —
 * which is what couples two versions of an envelope (Lewis & Shedler 1979; Ogata 1981).
 *
 * A candidate becomes a pulse when every rule below passes, tried in this order; the
 * first rule that fails names the counter it lands in:
 *   1. thinning      y < ρ(t)                          (not counted as suppressed: it is the method)
 *   2. refractory    Δ = t − lastOnset ≥ absolute, and y < ρ(t)·(1 − e^(−(Δ−abs)/recovery)) when recovery > 0
 *   3. clock         s = ⌊t·clockHz⌋; s − lastSample ≥ refractoryTicks (≥ 1)
 *   4. maxRate       s − lastSample ≥ ⌈clockHz / maxRateHz⌉
 *   5. window        s − (sample of the pulse maxPulses back) ≥ ⌈seconds·clockHz⌉
 * Δ and the tick rules are measured from the last KEPT onset (non-paralyzable dead
 * time); measuring from the last candidate would give the paralyzable rate λe^(−λτ).
 * lastOnset is the delivered time lastSample / clockHz, so the whole state entering a
 * block can be read back from a schedule file.
 *
 * Onsets go to the tick in which the candidate falls (floor). That keeps every pulse
 * of block b inside the block's own tick range, so a file splits cleanly into blocks.
 */
import { GUIDE_SIZE, type Compiled } from './compile';
import { BLOCK_SECONDS, type AleaState } from './seeds';
import { blockSampleRange, type SampleBuffer, type SweepCounts, type SweepState } from './sweep-state';

export * from './sweep-state';

/**
 * Sweep one block: appends kept samples to `out`, updates `state` and `counts`.
 * Alea is stepped on locals, in a form that gives exactly seedrandom's numbers but keeps
 * the carry off the critical path. seedrandom computes t = 2091639·s0 + c·2^-32,
 * c' = ⌊t⌋, s2' = t − c'. Here p = 2091639·s0 is split into ⌊p⌋ and its fraction first
 * (all exact: every value is a multiple of 2^-32 below 2^21), then the carry cc = c·2^-32
 * is added to the fraction; it pushes it over 1 only about once in 4000 steps (a branch
 * that is almost never taken). So each step waits on s0, drawn three steps earlier,
 * instead of on the previous step's carry.
 *
 * Hot loop: no allocation, the segment index only moves forward,
 * and per cell a [lo, hi] bound of ρ (padded for rounding) settles most candidates
 * without evaluating ρ — the decision is still exactly "y < ρ(t)" as computed below.
 * Two phases: thinning fills one array with every cell's survivors (each cell sorted,
 * cells in order, so the whole array is in time order); then one loop applies the
 * rules that look back, with no per-cell restart.
 */
export function sweepBlock(
  c: Compiled,
  rng: AleaState,
  block: number,
  state: SweepState,
  out: SampleBuffer,
  counts: SweepCounts,
): void {
  const t0 = block * BLOCK_SECONDS;
  const t1 = Math.min(t0 + BLOCK_SECONDS, c.durationS);
  if (!(t1 > t0)) return;
  const endExcl = blockSampleRange(c, block).to;
  const { starts, kind, c0, c1, c2, c3, pad, ceilingHz, clockHz, absoluteS, recoveryS } = c;
  const { refractoryTicks, maxRateTicks, windowTicks, windowMax, cellsPerBlock, cellS, cellCdf, cellGuide, spanCells } = c;
  const lastSeg = c.nSegments - 1;
  let { pos, ys, rhos } = scratchFor(4 * cellsPerBlock + 64);
  const ring = state.ring;
  let ringCount = state.ringCount;
  let ringHead = state.ringHead;
  let lastSample = state.lastSample;
  let lastOnset = lastSample / clockHz;
  let outData = out.data;
  let outLen = out.length;

  let a0 = rng.s0;
  let a1 = rng.s1;
  let a2 = rng.s2;
  let cc = rng.c * 2.3283064365386963e-10;
  let p = 0;
  let pi = 0;
  let f = 0;

  let seg = segmentAt(starts, c.nSegments, t0);
  let segStart = starts[seg];
  let segEnd = starts[seg + 1];
  let prevTh = NaN;
  let prevSin = 0;
  let spanEnd = 0;
  let spanSeg = -1;
  let lo = -Infinity;
  let hi = Infinity;
  let midU = 0;
  let halfU = Infinity;

  let candidates = 0;
  let thinned = 0;
  let refractory = 0;
  let clock = 0;
  let maxRate = 0;
  let window = 0;
  let kept = 0;
  let m = 0;

  for (let j = 0; j < cellsPerBlock; j++) {
    const cs = t0 + j * cellS;
    if (cs >= t1) break;
    const ce = t0 + (j + 1) * cellS;

    // Count: Poisson inversion with the first uniform of the cell.
    p = 2091639 * a0;
    pi = Math.trunc(p);
    f = p - pi + cc;
    if (f >= 1) {
      f -= 1;
      pi += 1;
    }
    a0 = a1;
    a1 = a2;
    a2 = f;
    cc = pi * 2.3283064365386963e-10;
    let n = cellGuide[(a2 * GUIDE_SIZE) | 0];
    while (a2 >= cellCdf[n]) n++;
    if (n === 0) continue;
    if (m + n > pos.length) ({ pos, ys, rhos } = growScratch(m + n));

    // The segment the cell starts in.
    while (seg < lastSeg && cs >= segEnd) {
      seg++;
      segStart = starts[seg];
      segEnd = starts[seg + 1];
    }
    if (j >= spanEnd || seg !== spanSeg) {
      // One [lo, hi] for the cells j … spanEnd − 1, when they lie inside one segment
      // (else for cell j alone, and unbounded if it crosses a segment edge).
      spanSeg = seg;
      spanEnd = Math.min(j + spanCells[seg], cellsPerBlock);
      // A position cs + u·L can round up to cs + L, which may differ from the cell end by an ulp.
      let top = Math.max(t0 + spanEnd * cellS, t0 + (spanEnd - 1) * cellS + cellS);
      if (!(top < segEnd || seg === lastSeg)) {
        spanEnd = j + 1;
        top = Math.max(ce, cs + cellS);
      }
      lo = -Infinity;
      hi = Infinity;
      if (top < segEnd || seg === lastSeg) {
        const la = cs - segStart;
        const lb = Math.min(top, segEnd) - segStart;
        if (kind[seg] === 0) {
          const ra = c0[seg] + c1[seg] * (la / c2[seg]);
          const rb = c0[seg] + c1[seg] * (lb / c2[seg]);
          lo = (ra < rb ? ra : rb) - pad[seg];
          hi = (ra < rb ? rb : ra) + pad[seg];
        } else {
          const tha = c2[seg] * la + c3[seg];
          const thb = c2[seg] * lb + c3[seg];
          // Consecutive spans share an edge: reuse its sine.
          const sa = tha === prevTh ? prevSin : boundSin(tha);
          const sb = boundSin(thb);
          prevTh = thb;
          prevSin = sb;
          let smin = sa < sb ? sa : sb;
          let smax = sa < sb ? sb : sa;
          if (thb - tha >= TWO_PI) {
            smin = -1;
            smax = 1;
          } else {
            // Multiplying by 1/2π may misplace a peak lying within ~1e-15 rad of a span edge;
            // the value missed there is ~depth·1e-30, far inside the pad.
            if (PEAK + TWO_PI * Math.ceil((tha - PEAK) * INV_TWO_PI) <= thb) smax = 1;
            if (TROUGH + TWO_PI * Math.ceil((tha - TROUGH) * INV_TWO_PI) <= thb) smin = -1;
          }
          lo = c0[seg] + c1[seg] * smin - pad[seg];
          hi = c0[seg] + c1[seg] * smax + pad[seg];
        }
      }
      midU = 0;
      halfU = Infinity;
      if (hi !== Infinity) {
        const mid = 0.5 * (lo + hi);
        const half = 0.5 * (hi - lo) + 1e-9 * (Math.abs(lo) + Math.abs(hi) + 1);
        midU = mid / ceilingHz;
        halfU = (half / ceilingHz) * (1 + 1e-9) + 1e-12;
      }
    }

    // Candidates in draw order: u → position, u → height. Thinning does not depend on
    // history, so it runs before sorting; only survivors are sorted into time order.
    const m0 = m;
    if (recoveryS > 0) {
      for (let i = 0; i < n; i++) {
        p = 2091639 * a0;
        pi = Math.trunc(p);
        f = p - pi + cc;
        if (f >= 1) {
          f -= 1;
          pi += 1;
        }
        a0 = a1;
        a1 = a2;
        a2 = f;
        cc = pi * 2.3283064365386963e-10;
        const t = cs + a2 * cellS;
        p = 2091639 * a0;
        pi = Math.trunc(p);
        f = p - pi + cc;
        if (f >= 1) {
          f -= 1;
          pi += 1;
        }
        a0 = a1;
        a1 = a2;
        a2 = f;
        cc = pi * 2.3283064365386963e-10;
        if (t >= t1) continue;
        const y = a2 * ceilingHz;
        candidates++;
        if (y >= hi) {
          thinned++;
          continue;
        }
        let sg = seg;
        while (sg < lastSeg && t >= starts[sg + 1]) sg++;
        const local = t - starts[sg];
        const rho = kind[sg] === 0 ? c0[sg] + c1[sg] * (local / c2[sg]) : c0[sg] + c1[sg] * Math.sin(c2[sg] * local + c3[sg]);
        if (y >= rho) {
          thinned++;
          continue;
        }
        pos[m] = t;
        ys[m] = y;
        rhos[m] = rho;
        m++;
      }
      sortSurvivors(pos, ys, rhos, m0, m);
    } else {
      // No relative refractoriness: ρ(t) is needed only for heights inside [lo, hi).
      // Outside it the bound decides. Every widening of the band for rounding may send
      // a few more candidates to the exact test, never fewer.
      let cellCandidates = n;
      if (cs + cellS < t1) {
        // The whole cell lies before t1: no position check. The band test is done on the
        // uniform itself (midU, halfU: the band over ceilingHz, widened for rounding), so
        // a height is computed only inside it; outside, "u < midU" is the decision, as a
        // flag, not a branch: it is a coin flip a branch would mispredict.
        for (let i = 0; i < n; i++) {
          p = 2091639 * a0;
          pi = Math.trunc(p);
          f = p - pi + cc;
          if (f >= 1) {
            f -= 1;
            pi += 1;
          }
          a0 = a1;
          a1 = a2;
          a2 = f;
          cc = pi * 2.3283064365386963e-10;
          pos[m] = cs + a2 * cellS;
          p = 2091639 * a0;
          pi = Math.trunc(p);
          f = p - pi + cc;
          if (f >= 1) {
            f -= 1;
            pi += 1;
          }
          a0 = a1;
          a1 = a2;
          a2 = f;
          cc = pi * 2.3283064365386963e-10;
          if (Math.abs(a2 - midU) <= halfU) {
            const t = pos[m];
            const y = a2 * ceilingHz;
            let sg = seg;
            while (sg < lastSeg && t >= starts[sg + 1]) sg++;
            const local = t - starts[sg];
            const rho = kind[sg] === 0 ? c0[sg] + c1[sg] * (local / c2[sg]) : c0[sg] + c1[sg] * Math.sin(c2[sg] * local + c3[sg]);
            if (y < rho) m++;
          } else {
            m += bit(a2 < midU);
          }
        }
      } else {
        // The cell reaching t1 (the end of a short last block): exact test for every candidate.
        cellCandidates = 0;
        for (let i = 0; i < n; i++) {
          p = 2091639 * a0;
          pi = Math.trunc(p);
          f = p - pi + cc;
          if (f >= 1) {
            f -= 1;
            pi += 1;
          }
          a0 = a1;
          a1 = a2;
          a2 = f;
          cc = pi * 2.3283064365386963e-10;
          const t = cs + a2 * cellS;
          p = 2091639 * a0;
          pi = Math.trunc(p);
          f = p - pi + cc;
          if (f >= 1) {
            f -= 1;
            pi += 1;
          }
          a0 = a1;
          a1 = a2;
          a2 = f;
          cc = pi * 2.3283064365386963e-10;
          if (t >= t1) continue;
          const y = a2 * ceilingHz;
          cellCandidates++;
          pos[m] = t;
          let sg = seg;
          while (sg < lastSeg && t >= starts[sg + 1]) sg++;
          const local = t - starts[sg];
          const rho = kind[sg] === 0 ? c0[sg] + c1[sg] * (local / c2[sg]) : c0[sg] + c1[sg] * Math.sin(c2[sg] * local + c3[sg]);
          if (y < rho) m++;
        }
      }
      candidates += cellCandidates;
      thinned += cellCandidates - (m - m0);
      sortTimes(pos, m0, m);
    }
  }

  // Survivors of the whole block, in time order (cells are disjoint and each is sorted),
  // through the rules that depend on earlier pulses.
  if (outLen + m > outData.length) {
    out.length = outLen;
    outData = out.reserve(m);
  }
  for (let i = 0; i < m; i++) {
      const t = pos[i];
      const since = t - lastOnset;
      if (since < absoluteS || (recoveryS > 0 && ys[i] >= rhos[i] * (1 - Math.exp(-(since - absoluteS) / recoveryS)))) {
        refractory++;
        continue;
      }
      let smp = Math.floor(t * clockHz);
      if (smp >= endExcl) smp = endExcl - 1;
      const gap = smp - lastSample;
      if (gap < refractoryTicks) {
        clock++;
        continue;
      }
      if (gap < maxRateTicks) {
        maxRate++;
        continue;
      }
      if (windowMax > 0) {
        if (ringCount === windowMax) {
          if (smp - ring[ringHead] < windowTicks) {
            window++;
            continue;
          }
          ring[ringHead] = smp;
          ringHead = ringHead + 1 === windowMax ? 0 : ringHead + 1;
        } else {
          ring[(ringHead + ringCount) % windowMax] = smp;
          ringCount++;
        }
      }
      outData[outLen++] = smp;
      kept++;
      lastSample = smp;
      lastOnset = smp / clockHz;
  }

  out.length = outLen;
  rng.s0 = a0;
  rng.s1 = a1;
  rng.s2 = a2;
  rng.c = cc * 4294967296;
  state.lastSample = lastSample;
  state.ringCount = ringCount;
  state.ringHead = ringHead;
  counts.candidates += candidates;
  counts.thinned += thinned;
  counts.refractory += refractory;
  counts.clock += clock;
  counts.maxRate += maxRate;
  counts.window += window;
  counts.kept += kept;
}

const TWO_PI = 2 * Math.PI;
const INV_TWO_PI = 1 / TWO_PI;
const PEAK = Math.PI / 2;
const TROUGH = (3 * Math.PI) / 2;

/**
 * Fast sine for the cell bounds only (never for a decision): reduction by 2π, folding,
 * Taylor series to r^13. Error ≤ 1e-9 plus 1e-15·|θ| from the reduction; compile.ts
 * pads every sine segment's bounds by more than that.
 */
function boundSin(th: number): number {
  let r = th - TWO_PI * Math.round(th * INV_TWO_PI);
  if (r > PEAK) r = Math.PI - r;
  else if (r < -PEAK) r = -Math.PI - r;
  const r2 = r * r;
  return (
    r *
    (1 +
      r2 *
        (-1 / 6 +
          r2 * (1 / 120 + r2 * (-1 / 5040 + r2 * (1 / 362880 + r2 * (-1 / 39916800 + r2 / 6227020800))))))
  );
}

let scratch = { pos: new Float64Array(64), ys: new Float64Array(64), rhos: new Float64Array(64) };
/** Survivor arrays with room for n: reused block after block (the block's survivors live here). */
function scratchFor(n: number) {
  if (scratch.pos.length < n) scratch = { pos: new Float64Array(n), ys: new Float64Array(n), rhos: new Float64Array(n) };
  return scratch;
}

/** Room for n, keeping what is stored (a block with more survivors than expected). */
function growScratch(n: number) {
  const old = scratch;
  const size = Math.max(n, 2 * old.pos.length);
  scratch = { pos: new Float64Array(size), ys: new Float64Array(size), rhos: new Float64Array(size) };
  scratch.pos.set(old.pos);
  scratch.ys.set(old.ys);
  scratch.rhos.set(old.rhos);
  return scratch;
}

function segmentAt(starts: Float64Array, n: number, t: number): number {
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid] <= t) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Insertion sort of the few survivors of a cell by time, carrying height and ρ along. */
function sortSurvivors(pos: Float64Array, ys: Float64Array, rhos: Float64Array, from: number, m: number): void {
  for (let i = from + 1; i < m; i++) {
    const t = pos[i];
    const y = ys[i];
    const r = rhos[i];
    let k = i;
    while (k > from && pos[k - 1] > t) {
      pos[k] = pos[k - 1];
      ys[k] = ys[k - 1];
      rhos[k] = rhos[k - 1];
      k--;
    }
    pos[k] = t;
    ys[k] = y;
    rhos[k] = r;
  }
}

const pair = new Float64Array(2);

/** Insertion sort of the few survivors of a cell by time. */
function sortTimes(pos: Float64Array, from: number, m: number): void {
  if (m - from === 2) {
    // The commonest case, without a data-dependent branch.
    const a = pos[from];
    const b = pos[from + 1];
    const swap = bit(b < a);
    pair[0] = a;
    pair[1] = b;
    pos[from] = pair[swap];
    pos[from + 1] = pair[swap ^ 1];
    return;
  }
  for (let i = from + 1; i < m; i++) {
    const t = pos[i];
    let k = i;
    while (k > from && pos[k - 1] > t) {
      pos[k] = pos[k - 1];
      k--;
    }
    pos[k] = t;
  }
}

/** 1 or 0. V8 turns `bool | 0` into a flag move, not a branch. */
function bit(b: boolean): number {
  return (b as unknown as number) | 0;
}
