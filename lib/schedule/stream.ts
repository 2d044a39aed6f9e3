/**
 * Streaming forms of the engine: pulses in time order, trial by trial, one 60 s block
 * in memory at a time. Exporters use `trialBlocks` (typed arrays, no per-pulse objects);
 * `streamPulses` is the friendly iterator on top of it.
 */
import { compileSpec, type Compiled } from './compile';
import { blockAleaState } from './seeds';
import type { Spec } from './spec';
import { assertValid } from './validate';
import {
  SampleBuffer,
  blockSampleRange,
  freshState,
  stateFromSamples,
  sweepBlock,
  zeroCounts,
  type SweepCounts,
  type SweepState,
} from './sweep';

export interface Pulse {
  trial: number;
  /** 0-based position within its trial. */
  index: number;
  onsetS: number;
  onsetSample: number;
}

/** Receives each block's kept samples; `samples` is reused after the call returns. */
export type BlockSink = (samples: Float64Array, length: number, firstIndex: number) => void;

export interface BlockChunk {
  block: number;
  /** Kept samples of this block in [0, length); the array is reused for the next block. */
  samples: Float64Array;
  length: number;
  /** pulse_index of samples[0] within the trial. */
  firstIndex: number;
}

/**
 * One trial, block by block, as a generator (so exporters can yield between blocks and
 * hold one block at a time). Returns the trial's counters when done.
 */
export function* trialBlocks(c: Compiled, trial: number): Generator<BlockChunk, SweepCounts, undefined> {
  const counts = zeroCounts();
  const state = freshState(c);
  const buf = new SampleBuffer();
  let index = 0;
  for (let b = 0; b < c.nBlocks; b++) {
    buf.clear();
    sweepBlock(c, blockAleaState(c.spec.seed, trial, b), b, state, buf, counts);
    if (buf.length > 0) yield { block: b, samples: buf.data, length: buf.length, firstIndex: index };
    index += buf.length;
  }
  return counts;
}

/** Run one trial block by block; returns its counters. */
export function runTrial(c: Compiled, trial: number, onBlock: BlockSink): SweepCounts {
  const it = trialBlocks(c, trial);
  for (;;) {
    const r = it.next();
    if (r.done) return r.value;
    onBlock(r.value.samples, r.value.length, r.value.firstIndex);
  }
}

/** All kept samples of one trial (for tests and small schedules; memory grows with duration). */
export function trialSamples(c: Compiled, trial: number): { samples: Float64Array; counts: SweepCounts } {
  const all = new SampleBuffer();
  const counts = runTrial(c, trial, (s, n) => {
    for (let i = 0; i < n; i++) all.push(s[i]);
  });
  return { samples: all.data.slice(0, all.length), counts };
}

export interface StreamOptions {
  /** Which trials, in this order (default: all, ascending). */
  trials?: readonly number[];
  /** Called after each trial with its counters (statistics without holding pulses). */
  onTrialEnd?: (trial: number, counts: SweepCounts) => void;
}

/** Pulses in time order, trial by trial. Validates the spec first (throws SpecInvalidError). */
export function* streamPulses(spec: Spec, opts: StreamOptions = {}): Generator<Pulse, void, undefined> {
  assertValid(spec);
  const c = compileSpec(spec);
  const trials = opts.trials ?? Array.from({ length: spec.trials }, (_, i) => i);
  for (const trial of trials) {
    const it = trialBlocks(c, trial);
    for (;;) {
      const r = it.next();
      if (r.done) {
        opts.onTrialEnd?.(trial, r.value);
        break;
      }
      const { samples, length, firstIndex } = r.value;
      for (let i = 0; i < length; i++) {
        const s = samples[i];
        yield { trial, index: firstIndex + i, onsetS: s / c.clockHz, onsetSample: s };
      }
    }
  }
}

export interface BlockResult {
  samples: number[];
  counts: SweepCounts;
  /** State leaving the block: pass it as `before` to regenerate block + 1 alone. */
  stateOut: SweepState;
}

/**
 * Regenerate block `block` of one trial alone. `before` is the trial's kept samples
 * that precede the block (only the last few matter: the last onset and, with a window
 * cap, the last maxPulses), or a state returned by a previous call.
 */
export function streamBlock(
  spec: Spec,
  trial: number,
  block: number,
  before: ArrayLike<number> | SweepState = [],
): BlockResult {
  assertValid(spec);
  const c = compileSpec(spec);
  if (!Number.isInteger(block) || block < 0 || block >= c.nBlocks) {
    throw new RangeError(`block ${block} outside 0..${c.nBlocks - 1}`);
  }
  const state = isState(before) ? cloneState(before) : stateFromSamples(c, before);
  const buf = new SampleBuffer();
  const counts = zeroCounts();
  sweepBlock(c, blockAleaState(spec.seed, trial, block), block, state, buf, counts);
  return { samples: Array.from(buf.data.subarray(0, buf.length)), counts, stateOut: state };
}

/** Tick range [from, to) that block b's onsets fall in. */
export function blockTicks(spec: Spec, block: number): { from: number; to: number } {
  return blockSampleRange(compileSpec(spec), block);
}

function isState(x: ArrayLike<number> | SweepState): x is SweepState {
  return (x as SweepState).ring instanceof Float64Array;
}

function cloneState(s: SweepState): SweepState {
  return { lastSample: s.lastSample, ring: s.ring.slice(), ringCount: s.ringCount, ringHead: s.ringHead };
}
