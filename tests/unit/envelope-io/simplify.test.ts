import { describe, expect, it } from 'vitest';
import { maxRateError, parseEnvelopeCsv, simplifyTrace, type TracePoint } from '@/lib/envelope-io';

/** Small seeded generator so the noisy trace is the same on every run. */
function mulberry32(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A recorded-looking rate trace: slow swell, a burst, a step, and noise. */
function trace(n: number, seed = 7): TracePoint[] {
  const rnd = mulberry32(seed);
  return Array.from({ length: n }, (_, i) => {
    const t = i * 0.01;
    let hz = 20 + 10 * Math.sin(t / 3) + (t > 40 && t < 42 ? 35 : 0) + (t >= 60 ? 15 : 0) + (rnd() - 0.5) * 4;
    hz = Math.max(0, hz);
    return { t: Number(t.toFixed(2)), hz };
  });
}

/**
 * Independent oracle: for every original point, the vertical distance to every
 * segment of the simplified trace that spans its time; the nearest counts. O(n·m).
 */
function bruteForceMaxError(original: TracePoint[], kept: TracePoint[]): number {
  let worst = 0;
  for (const p of original) {
    let best = Infinity;
    for (let s = 0; s + 1 < kept.length; s++) {
      const a = kept[s];
      const b = kept[s + 1];
      if (p.t < a.t || p.t > b.t) continue;
      const d = a.t === b.t ? (p.hz >= Math.min(a.hz, b.hz) && p.hz <= Math.max(a.hz, b.hz) ? 0 : Math.min(Math.abs(p.hz - a.hz), Math.abs(p.hz - b.hz))) : Math.abs(p.hz - (a.hz + ((b.hz - a.hz) * (p.t - a.t)) / (b.t - a.t)));
      best = Math.min(best, d);
    }
    worst = Math.max(worst, best);
  }
  return worst;
}

describe('simplifyTrace (Ramer–Douglas–Peucker)', () => {
  const original = trace(8000);

  it('meets the breakpoint budget, keeps the ends and only original points', () => {
    const { points, report } = simplifyTrace(original, 300);
    expect(points.length).toBeLessThanOrEqual(300);
    expect(points.length).toBeGreaterThan(200);
    expect(report).toMatchObject({ from: 8000, to: points.length });
    expect(points[0]).toBe(original[0]);
    expect(points[points.length - 1]).toBe(original[original.length - 1]);
    const set = new Set(original);
    for (const p of points) expect(set.has(p)).toBe(true);
    for (let i = 1; i < points.length; i++) expect(points[i].t).toBeGreaterThanOrEqual(points[i - 1].t);
  });

  it('reports the maximum rate error that a brute-force check finds', () => {
    for (const budget of [40, 300, 1500]) {
      const { points, report } = simplifyTrace(original, budget);
      const oracle = bruteForceMaxError(original, points);
      expect(report.maxRateErrorHz).toBeCloseTo(oracle, 9);
      expect(oracle).toBeGreaterThan(0);
    }
  });

  it('trades points for error: a smaller budget never fits better here', () => {
    const e = [40, 300, 1500].map((b) => simplifyTrace(original, b).report.maxRateErrorHz);
    expect(e[0]).toBeGreaterThan(e[1]);
    expect(e[1]).toBeGreaterThan(e[2]);
    // The 35 Hz burst survives even a tight budget.
    expect(e[0]).toBeLessThan(20);
  });

  it('reduces a straight line to its two ends with no error', () => {
    const line = Array.from({ length: 5000 }, (_, i) => ({ t: i * 0.002, hz: 3 + i * 0.01 }));
    const { points, report } = simplifyTrace(line, 100);
    expect(points).toEqual([line[0], line[4999]]);
    expect(report.maxRateErrorHz).toBeLessThan(1e-9);
  });

  it('leaves a short trace alone', () => {
    const short = trace(50);
    expect(simplifyTrace(short, 50)).toEqual({ points: short, report: { from: 50, to: 50, maxRateErrorHz: 0 } });
  });

  it('treats a step as covering every rate between its two values', () => {
    const kept = [
      { t: 0, hz: 0 },
      { t: 1, hz: 0 },
      { t: 1, hz: 10 },
      { t: 2, hz: 10 },
    ];
    expect(maxRateError([{ t: 1, hz: 4 }], kept)).toBe(0);
    expect(maxRateError([{ t: 1, hz: 14 }], kept)).toBe(4);
    expect(maxRateError([{ t: 1.5, hz: 7 }], kept)).toBe(3);
  });

  it('runs inside the CSV import', () => {
    const csv = `time_s,rate_hz\n${original.map((p) => `${p.t},${p.hz}`).join('\n')}\n`;
    const r = parseEnvelopeCsv(csv, { maxPoints: 500 });
    expect(r.ok).toBe(true);
    expect(r.simplified.from).toBe(8000);
    expect(r.simplified.to).toBeLessThanOrEqual(500);
    expect(r.points).toHaveLength(r.simplified.to);
    const parsed = csv.trim().split('\n').slice(1).map((l) => ({ t: Number(l.split(',')[0]), hz: Number(l.split(',')[1]) }));
    expect(r.simplified.maxRateErrorHz).toBeCloseTo(bruteForceMaxError(parsed, r.points), 9);
  });
});
