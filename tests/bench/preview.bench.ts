/**
 * Preview benchmark: server time of one live preview, not pass/fail. Run with
 *   npx tsx tests/bench/preview.bench.ts
 * Goal (issue 4): a preview of 20 trials × 60 s under a 200 Hz ceiling in < 150 ms, median.
 *
 * Rows, each the median and 95th percentile of interleaved repetitions in this process:
 *  1. baseline: the engine alone (generateSchedule) on the same spec and trials
 *  2. buildPreview: engine + binned rate with Poisson band, intervals, counts, summary
 *  3. JSON.stringify of the preview response (what the route sends)
 *  4. the route's whole path: JSON.parse of the request body → parsePreviewRequest → buildPreview → JSON.stringify
 * Ratios are against row 1, measured back to back, so they hold on a busy shared machine
 * where the absolute times move.
 *
 * Two envelopes: one whose 60 s the preview covers whole (its expected pulses fit the
 * preview's budget), and a dense one near the ceiling, which the preview cuts to its
 * first seconds by design (PREVIEW_BUDGET) — shown to say what the budget buys.
 */
import { buildPreview, parsePreviewRequest, PREVIEW_BUDGET, PREVIEW_MAX_TRIALS } from '../../lib/preview';
import { generateSchedule } from '../../lib/schedule';
import type { Spec } from '../../lib/schedule/spec';
import { truncateEnvelope } from '../../lib/preview/truncate';

const GOAL_MS = 150;
const TRIALS = 20;
const REPS = Number(process.env.BENCH_REPS ?? 25);
const WARMUP = 4;

function spec(name: string, envelope: Spec['envelope']): { name: string; spec: Spec } {
  return {
    name,
    spec: {
      format: 'pulseloom-spec/1',
      envelope,
      ceilingHz: 200,
      refractory: { absoluteMs: 2, recoveryMs: 0 },
      pulse: { widthMs: 1, amplitude: 5, unit: 'mW' },
      trials: TRIALS,
      seed: 'bench-preview-60s',
      clockHz: 10_000,
    },
  };
}

const CASES = [
  // Peaks at the 200 Hz ceiling; 1,400 + 2 × 505 = 2,410 expected pulses per trial, 48,200 over 20 trials (budget 50,000).
  spec('sine 28 ± 26 Hz, then a ramp to the ceiling and back, 60 s', [
    { kind: 'sine', durationS: 50, meanHz: 28, depthHz: 26, freqHz: 0.5, phaseDeg: 0 },
    { kind: 'ramp', durationS: 5, fromHz: 2, toHz: 200 },
    { kind: 'ramp', durationS: 5, fromHz: 200, toHz: 2 },
  ]),
  // Mean 150 Hz: 9,000 expected per trial; the preview shows the first seconds only.
  spec('dense: sine 150 ± 45 Hz, 60 s (cut by the budget)', [{ kind: 'sine', durationS: 60, meanHz: 150, depthHz: 45, freqHz: 0.2, phaseDeg: 0 }]),
];

function quantile(sorted: number[], q: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i];
}

function stats(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  return { median: quantile(s, 0.5), p95: quantile(s, 0.95) };
}

function time(fn: () => unknown): number {
  const t0 = performance.now();
  const out = fn();
  const dt = performance.now() - t0;
  if (out === null) console.log(''); // keep the result alive
  return dt;
}

const fmt = (ms: number) => ms.toFixed(1).padStart(8);

console.log(`preview benchmark — ${TRIALS} trials (the route's maximum is ${PREVIEW_MAX_TRIALS}), ${REPS} repetitions after ${WARMUP} warm-ups, node ${process.version}`);
for (const c of CASES) {
  const body = JSON.stringify({ spec: c.spec, trials: TRIALS });
  const probe = buildPreview(c.spec, { trials: TRIALS });
  // The baseline runs the engine on exactly what the preview runs it on (its cut, if any).
  const engineSpec: Spec = { ...c.spec, trials: TRIALS, envelope: probe.truncated ? truncateEnvelope(c.spec.envelope, probe.coveredS) : c.spec.envelope };
  const pulses = probe.counts.perTrial.reduce((a, b) => a + b, 0);

  const rows = { engine: [] as number[], build: [] as number[], stringify: [] as number[], route: [] as number[] };
  let bytes = 0;
  for (let i = 0; i < WARMUP + REPS; i++) {
    const e = time(() => generateSchedule(engineSpec));
    let built: ReturnType<typeof buildPreview> | null = null;
    const b = time(() => (built = buildPreview(c.spec, { trials: TRIALS })));
    const s = time(() => (bytes = JSON.stringify(built).length));
    const r = time(() => {
      const parsed = parsePreviewRequest(JSON.parse(body));
      if (!parsed.ok) throw new Error(parsed.errors[0].message);
      return JSON.stringify(buildPreview(parsed.spec, { trials: parsed.trials }));
    });
    if (i >= WARMUP) {
      rows.engine.push(e);
      rows.build.push(b);
      rows.stringify.push(s);
      rows.route.push(r);
    }
  }
  const base = stats(rows.engine).median;
  console.log(`\n${c.name}`);
  console.log(
    `  previewed ${probe.coveredS} s of ${probe.durationS} s${probe.truncated ? ' (cut by the preview budget)' : ''}; ` +
      `${pulses.toLocaleString('en-US')} pulses over ${TRIALS} trials (budget ${PREVIEW_BUDGET.pulses.toLocaleString('en-US')}); response ${(bytes / 1024).toFixed(0)} KiB`,
  );
  console.log(`  ${'what'.padEnd(52)}${'median ms'.padStart(10)}${'p95 ms'.padStart(9)}${'× engine'.padStart(10)}   goal`);
  const line = (what: string, xs: number[], goal = '') => {
    const st = stats(xs);
    console.log(`  ${what.padEnd(52)}${fmt(st.median)}  ${fmt(st.p95)}${(st.median / base).toFixed(2).padStart(9)}×   ${goal}`);
  };
  line('engine alone: generateSchedule (baseline)', rows.engine);
  line('buildPreview', rows.build, `< ${GOAL_MS} ms median: ${stats(rows.build).median < GOAL_MS ? 'met' : 'NOT met'}`);
  line('JSON.stringify(response)', rows.stringify);
  line('route path: parse → build → serialize', rows.route, `< ${GOAL_MS} ms median: ${stats(rows.route).median < GOAL_MS ? 'met' : 'NOT met'}`);
}
