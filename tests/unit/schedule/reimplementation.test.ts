/**
 * A second, deliberately plain implementation written from the manifest's own method
 * text (manifest.method, seedDerivation, rng) — seedrandom called as a function,
 * Math.sin for every candidate, arrays instead of ring buffers, no shortcuts. If the
 * engine's fast paths (inlined Alea steps, per-cell envelope bounds, typed arrays) ever
 * changed a decision, or the manifest stopped describing the engine, the pulses differ.
 */
import { createHash } from 'node:crypto';
import fc from 'fast-check';
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import { buildManifest } from '../../../lib/schedule/manifest';
import { generateSchedule } from '../../../lib/schedule/generate';
import type { Spec } from '../../../lib/schedule/spec';
import { specArb } from './helpers/arbitrary';

function rateAt(spec: Spec, t: number): number {
  let start = 0;
  for (let i = 0; i < spec.envelope.length; i++) {
    const seg = spec.envelope[i];
    const end = start + seg.durationS;
    if (t < end || i === spec.envelope.length - 1) {
      const local = t - start;
      if (seg.kind === 'ramp') return seg.fromHz + (seg.toHz - seg.fromHz) * (local / seg.durationS);
      return seg.meanHz + seg.depthHz * Math.sin(2 * Math.PI * seg.freqHz * local + seg.phaseDeg * (Math.PI / 180));
    }
    start = end;
  }
  return 0;
}

function poissonCdf(mu: number): number[] {
  const F = [Math.exp(-mu)];
  let p = F[0];
  for (let k = 1; k < 1000; k++) {
    p = (p * mu) / k;
    const next = F[F.length - 1] + p;
    if (next === F[F.length - 1] && k > mu) break;
    F.push(next);
  }
  F.push(1);
  return F;
}

const ceilTicks = (x: number) => Math.ceil(x - 1e-9);

function referenceTrial(spec: Spec, trial: number): number[] {
  const T = spec.envelope.reduce((a, s) => a + s.durationS, 0);
  const clk = spec.clockHz;
  const C = spec.ceilingHz;
  const K = Math.max(1, Math.ceil((60 * C) / 4));
  const L = 60 / K;
  const F = poissonCdf(C * L);
  const abs = spec.refractory.absoluteMs / 1000;
  const rec = spec.refractory.recoveryMs / 1000;
  const refTicks = Math.max(1, ceilTicks((spec.refractory.absoluteMs / 1000) * clk));
  const rateTicks = spec.caps?.maxRateHz ? ceilTicks(clk / spec.caps.maxRateHz) : 0;
  const win = spec.caps?.window;
  const winTicks = win ? ceilTicks(win.seconds * clk) : 0;
  const kept: number[] = [];
  for (let b = 0; b < Math.ceil(T / 60); b++) {
    const seed = createHash('sha256').update(`${spec.seed}\u0000${trial}\u0000${b}`, 'utf8').digest('hex');
    const u = seedrandom.alea(seed);
    const end = Math.min(60 * (b + 1), T);
    const endSample = Math.min(60 * (b + 1) * clk, Math.ceil(T * clk));
    for (let j = 0; j < K; j++) {
      const cs = 60 * b + j * L;
      if (cs >= end) break;
      const v = u();
      let n = 0;
      while (v >= F[n]) n++;
      const pairs = Array.from({ length: n }, () => ({ t: cs + u() * L, y: u() * C }))
        .filter((p) => p.t < end)
        .map((p) => ({ ...p, rho: rateAt(spec, p.t) }))
        .filter((p) => p.y < p.rho)
        .sort((a, z) => a.t - z.t);
      for (const { t, y, rho } of pairs) {
        const last = kept.length ? kept[kept.length - 1] : -Infinity;
        const d = t - last / clk;
        if (d < abs || (rec > 0 && y >= rho * (1 - Math.exp(-(d - abs) / rec)))) continue;
        const s = Math.min(Math.floor(t * clk), endSample - 1);
        if (s - last < refTicks || s - last < rateTicks) continue;
        if (win && kept.length >= win.maxPulses && s - kept[kept.length - win.maxPulses] < winTicks) continue;
        kept.push(s);
      }
    }
  }
  return kept;
}

describe('engine against a plain reimplementation of its manifest', () => {
  it('the manifest names the method the reference follows', () => {
    const m = buildManifest(specExample() as Spec);
    expect(m.method.cloud).toContain('ceil(60·ceilingHz/4)');
    expect(m.seedDerivation).toContain("'\\u0000'");
    expect(m.rng).toContain('alea');
  });

  it('gives identical onsets on random valid specs (fast-check)', () => {
    fc.assert(
      fc.property(specArb, (spec) => {
        const s = generateSchedule(spec);
        for (const tr of s.trials) expect(tr.onsetSamples).toEqual(referenceTrial(spec, tr.trial));
      }),
      { numRuns: 30, seed: 314 },
    );
  });
});

function specExample() {
  return {
    format: 'pulseloom-spec/1',
    envelope: [{ kind: 'ramp', durationS: 5, fromHz: 1, toHz: 9 }],
    ceilingHz: 10,
    refractory: { absoluteMs: 2, recoveryMs: 0 },
    pulse: { widthMs: 1, amplitude: 1, unit: 'mW' },
    trials: 1,
    seed: 'ref',
    clockHz: 1000,
  };
}
