/**
 * Which pulses two schedules share. The engine thins one seeded candidate cloud, so two
 * specs with the same seed keep the same candidates wherever their rules agree: a pulse
 * is unchanged when the same onset appears in both, and otherwise added or removed.
 * Inputs are per-trial onset samples in ascending order, as the engine emits them.
 */
export type TrialComparison = {
  trial: number;
  /** Onsets in seconds. */
  unchanged: number[];
  /** Only in the earlier version. */
  removed: number[];
  /** Only in the later version. */
  added: number[];
};

/**
 * Same onset, clock-aware: samples a/clockA and b/clockB are the same instant when
 * a·clockB = b·clockA. BigInt keeps that exact beyond 2^53 (24 h at 100 MHz).
 */
function cmp(a: number, clockA: number, b: number, clockB: number): number {
  if (clockA === clockB) return a - b;
  const left = BigInt(a) * BigInt(clockB);
  const right = BigInt(b) * BigInt(clockA);
  return left < right ? -1 : left > right ? 1 : 0;
}

export function compareTrial(
  trial: number,
  before: { samples: ArrayLike<number>; clockHz: number },
  after: { samples: ArrayLike<number>; clockHz: number },
): TrialComparison {
  const out: TrialComparison = { trial, unchanged: [], removed: [], added: [] };
  const A = before.samples;
  const B = after.samples;
  let i = 0;
  let j = 0;
  while (i < A.length || j < B.length) {
    if (j >= B.length) {
      out.removed.push(A[i++]! / before.clockHz);
    } else if (i >= A.length) {
      out.added.push(B[j++]! / after.clockHz);
    } else {
      const c = cmp(A[i]!, before.clockHz, B[j]!, after.clockHz);
      if (c === 0) {
        out.unchanged.push(A[i]! / before.clockHz);
        i++;
        j++;
      } else if (c < 0) {
        out.removed.push(A[i++]! / before.clockHz);
      } else {
        out.added.push(B[j++]! / after.clockHz);
      }
    }
  }
  return out;
}

export function summarizeComparison(trials: readonly TrialComparison[]) {
  let unchanged = 0;
  let removed = 0;
  let added = 0;
  for (const t of trials) {
    unchanged += t.unchanged.length;
    removed += t.removed.length;
    added += t.added.length;
  }
  return { unchanged, removed, added };
}
