import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LIMITS, SPEC_FORMAT, modalityOf, parseSpec, specSchema, type Spec } from '../../../lib/schedule/spec';

const example = (name: string): Spec =>
  JSON.parse(readFileSync(new URL(`../../../lib/schedule/examples/${name}.json`, import.meta.url), 'utf8')) as Spec;

const optical = () => structuredClone(example('optical-ramp-sine'));
const electrical = () => structuredClone(example('electrical-biphasic'));

function errorsOf(input: unknown) {
  const r = parseSpec(input);
  expect(r.ok).toBe(false);
  return r.ok ? [] : r.errors;
}

function expectError(input: unknown, path: string, pattern: RegExp) {
  const errs = errorsOf(input);
  expect(errs.some((e) => e.path === path && pattern.test(e.message)), JSON.stringify(errs, null, 1)).toBe(true);
}

describe('spec examples', () => {
  it('both shipped examples are valid, with modality inferred from the unit', () => {
    const o = parseSpec(optical());
    const e = parseSpec(electrical());
    expect(o.ok && modalityOf(o.spec)).toBe('optical');
    expect(e.ok && modalityOf(e.spec)).toBe('electrical');
  });
});

describe('spec validation: every rule from the issue, at its JSON path', () => {
  it('refuses non-finite numbers', () => {
    const s = optical() as any;
    s.ceilingHz = Infinity;
    s.envelope[0].toHz = NaN;
    const errs = errorsOf(s);
    expect(errs).toContainEqual({ path: 'ceilingHz', message: 'ceilingHz must be a finite number' });
    expect(errs).toContainEqual({ path: 'envelope[0].toHz', message: 'toHz must be a finite number' });
  });

  it('refuses negative rates', () => {
    const s = optical() as any;
    s.envelope[0].fromHz = -1;
    expectError(s, 'envelope[0].fromHz', /≥ 0/);
  });

  it('refuses a sine that dips below 0 inside its segment, using the exact trough', () => {
    const s = optical() as any;
    s.envelope[2] = { kind: 'sine', durationS: 10, meanHz: 5, depthHz: 8, freqHz: 0.25, phaseDeg: 0 };
    expectError(s, 'envelope[2]', /dips to -3 Hz/);
    // Same numbers, but the segment ends before the trough (sin reaches −1 at 3 s): valid.
    s.envelope[2].durationS = 2;
    expect(parseSpec(s).ok).toBe(true);
  });

  it('refuses a sine that rises above the ceiling', () => {
    const s = optical() as any;
    s.envelope[2].depthHz = 9.9;
    s.envelope[2].meanHz = 16;
    expectError(s, 'envelope[2]', /above ceilingHz 25/);
  });

  it('refuses an envelope above caps.maxRateHz instead of clipping it', () => {
    const s = optical() as any;
    s.caps.maxRateHz = 11;
    expectError(s, 'envelope[0].toHz', /above caps\.maxRateHz 11 \(never clipped/);
    expectError(s, 'envelope[1].fromHz', /above caps\.maxRateHz/);
  });

  it('refuses an absolute refractory shorter than the pulse', () => {
    const s = optical() as any;
    s.refractory.absoluteMs = 7.9;
    expectError(s, 'refractory.absoluteMs', /shorter than the pulse \(8 ms\)/);
  });

  it('electrical: the refractory must cover both phases and the gap, and widthMs must equal them', () => {
    const s = electrical() as any;
    s.refractory.absoluteMs = 0.44;
    expectError(s, 'refractory.absoluteMs', /0\.45 ms: both phases and the gap/);
    const w = electrical() as any;
    w.pulse.widthMs = 0.2;
    expectError(w, 'pulse.widthMs', /= 0\.45 ms/);
    const p = electrical() as any;
    delete p.pulse.phases;
    expectError(p, 'pulse.phases', /need phases/);
  });

  it('refuses more than 24 h, more than 1,000 trials, more than 100,000 segments', () => {
    const long = optical() as any;
    long.envelope = [{ kind: 'ramp', durationS: 86_400.5, fromHz: 1, toHz: 1 }];
    expectError(long, 'envelope', /more than 24 h/);
    const many = optical() as any;
    many.trials = LIMITS.maxTrials + 1;
    expectError(many, 'trials', /more than 1000 trials/);
    const segs = optical() as any;
    segs.envelope = Array.from({ length: LIMITS.maxSegments + 1 }, () => ({ kind: 'ramp', durationS: 0.1, fromHz: 1, toHz: 1 }));
    expectError(segs, 'envelope', /more than 100000 segments/);
  });

  it('accepts exactly 24 h and exactly 1,000 trials', () => {
    const s = optical() as any;
    s.envelope = [{ kind: 'ramp', durationS: 86_400, fromHz: 1, toHz: 1 }];
    s.trials = 1000;
    expect(parseSpec(s).ok).toBe(true);
  });

  it('refuses an unknown format version and unknown keys (a typo must not drop a cap silently)', () => {
    const s = optical() as any;
    s.format = 'pulseloom-spec/2';
    s.caps.windw = s.caps.window;
    delete s.caps.window;
    expectError(s, 'format', /unknown format version "pulseloom-spec\/2"/);
    expectError(s, 'caps', /windw/);
  });

  it('lists every problem at once, cross-field ones included', () => {
    const s = optical() as any;
    s.trials = 2.5;
    s.seed = '';
    s.refractory.absoluteMs = 1;
    s.envelope[2].depthHz = 30;
    const paths = errorsOf(s).map((e) => e.path);
    expect(paths).toEqual(expect.arrayContaining(['trials', 'seed', 'refractory.absoluteMs', 'envelope[2]']));
  });

  it('the exported schema and parseSpec agree', () => {
    expect(specSchema.safeParse(optical()).success).toBe(true);
    expect(SPEC_FORMAT).toBe('pulseloom-spec/1');
  });
});

describe('parseSpec on garbage (fuzz, fast-check)', () => {
  it('never throws on arbitrary values and always returns a non-empty error list with string paths', () => {
    fc.assert(
      fc.property(fc.anything({ withBoxedValues: true, withMap: true, withSet: true, withTypedArray: true }), (x) => {
        const r = parseSpec(x);
        if (r.ok) return;
        expect(r.errors.length).toBeGreaterThan(0);
        for (const e of r.errors) {
          expect(typeof e.path).toBe('string');
          expect(typeof e.message).toBe('string');
        }
      }),
      { numRuns: 400, seed: 1701 },
    );
  });

  it('never throws on a valid spec with one field replaced by arbitrary JSON', () => {
    const leaves = (o: unknown, prefix: (string | number)[] = []): (string | number)[][] =>
      typeof o === 'object' && o !== null
        ? Object.entries(o).flatMap(([k, v]) => [[...prefix, Array.isArray(o) ? Number(k) : k], ...leaves(v, [...prefix, Array.isArray(o) ? Number(k) : k])])
        : [];
    const base = electrical();
    const paths = leaves(base);
    fc.assert(
      fc.property(fc.constantFrom(...paths), fc.jsonValue(), (path, value) => {
        const s = structuredClone(base) as any;
        let o = s;
        for (const k of path.slice(0, -1)) o = o[k];
        o[path[path.length - 1]] = value;
        const r = parseSpec(s);
        if (!r.ok) expect(r.errors.length).toBeGreaterThan(0);
      }),
      { numRuns: 500, seed: 42 },
    );
  });

  it('survives cyclic input, throwing getters and hostile proxies', () => {
    const cyc: any = optical();
    cyc.envelope.push(cyc);
    cyc.pulse.self = cyc;
    expect(parseSpec(cyc).ok).toBe(false);
    const getter = { get format() { throw new Error('boom'); } };
    expect(parseSpec(getter)).toEqual({ ok: false, errors: [{ path: '$', message: 'spec could not be read: boom' }] });
    const proxy = new Proxy({}, { get() { throw 1; }, ownKeys() { throw 2; } });
    expect(parseSpec(proxy).ok).toBe(false);
  });
});
