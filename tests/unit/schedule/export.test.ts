import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import seedrandom from 'seedrandom';
import { describe, expect, it } from 'vitest';
import {
  CSV_HEADER,
  PREVIEW_NOTICE,
  buildManifest,
  csvLines,
  generateSchedule,
  jsonChunks,
  readScheduleFile,
  verifySchedule,
  type Spec,
} from '../../../lib/schedule/index';
import { aleaNext, blockAleaState, blockSeed } from '../../../lib/schedule/seeds';
import { sha256Hex } from '../../../lib/schedule/sha256';
import { ByteWriter, ascii, decimalPlan, writeRows, writeSeconds } from '../../../lib/schedule/export/ascii';
import fc from 'fast-check';

const example = (name: string): Spec =>
  JSON.parse(readFileSync(new URL(`../../../lib/schedule/examples/${name}.json`, import.meta.url), 'utf8')) as Spec;
const optical = example('optical-ramp-sine');
const electrical = example('electrical-biphasic');
const meta = { protocol: 'vole-place-cells', version: 3, approvedBy: 'R. Okafor', approvedAt: '2031-04-02T09:15:00Z', status: 'approved', channel: 'LED 2, left' };

const nodeSha = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex');

describe('CSV export', () => {
  const chunks = [...csvLines(optical, meta)];
  const text = chunks.join('');
  const lines = text.split('\n');
  const schedule = generateSchedule(optical);

  it('starts with # key: value comments, then the manifest, then the documented column header', () => {
    const comments = lines.filter((l) => l.startsWith('#'));
    const keys = comments.map((l) => /^# ([A-Za-z]+):/.exec(l)?.[1]);
    expect(keys).toEqual(['format', 'engine', 'seed', 'clockHz', 'trials', 'pulses', 'checksum', 'protocol', 'version', 'approvedBy', 'approvedAt', 'status', 'channel', 'manifest']);
    expect(lines[0]).toBe('# format: pulseloom-schedule/1');
    expect(lines).toContain(`# checksum: ${schedule.manifest.checksum}`);
    expect(lines).toContain('# channel: LED 2, left');
    const manifestLine = comments.find((l) => l.startsWith('# manifest: '))!;
    expect(JSON.parse(manifestLine.slice('# manifest: '.length))).toEqual(schedule.manifest);
    expect(lines[comments.length]).toBe(CSV_HEADER);
    expect(CSV_HEADER).toBe('trial,pulse_index,onset_s,onset_sample,width_ms,amplitude,unit,phase_width_us,phase_gap_us,leading_phase,channel');
  });

  it('has one row per pulse, in trial then time order, with empty phase columns for light and a quoted channel', () => {
    const rows = lines.slice(lines.indexOf(CSV_HEADER) + 1).filter(Boolean);
    const expected = schedule.trials.flatMap((t) =>
      t.onsetSamples.map((s, i) => `${t.trial},${i},${s / optical.clockHz},${s},8,6.5,mW,,,,"LED 2, left"`),
    );
    expect(rows).toEqual(expected);
  });

  it('fills the phase columns for a biphasic pulse', () => {
    const row = [...csvLines(electrical)].join('').split('\n').find((l) => /^0,0,/.test(l));
    expect(row).toMatch(/^0,0,[0-9.e-]+,\d+,0\.45,60,uA,200,50,cathodic,$/);
  });

  it('a draft says PREVIEW — NOT APPROVED FOR USE on its first line', () => {
    const first = [...csvLines(optical, { ...meta, preview: true })][0].split('\n')[0];
    expect(first).toBe(`# ${PREVIEW_NOTICE}`);
    expect(PREVIEW_NOTICE).toBe('PREVIEW — NOT APPROVED FOR USE');
  });

  it('streams block by block: no chunk holds more than one 60 s block of rows', () => {
    // Peak rate 12 Hz × 60 s = 720 expected candidates per block; rows are < 60 characters.
    const rowChunks = chunks.slice(1);
    expect(rowChunks.length).toBeGreaterThanOrEqual(optical.trials * 3);
    for (const c of rowChunks) expect(c.split('\n').length - 1).toBeLessThan(1000);
  });

  it('refuses meta keys that would forge the header', () => {
    expect(() => [...csvLines(optical, { checksum: 'sha256:0' })]).toThrow(/written by the exporter/);
    expect(() => [...csvLines(optical, { 'bad key': 'x' })]).toThrow(/letters, digits/);
  });

  it('encodes comment values with line breaks as JSON strings so one line stays one field', () => {
    const t = [...csvLines(optical, { protocol: 'two\nlines' })].join('');
    expect(t).toContain('# protocol: "two\\nlines"');
  });
});

describe('onset_s text', () => {
  it('is exactly String(onsetSample / clockHz) for every clock, on the fast and the general path (fast-check)', () => {
    const clocks = [1, 1000, 1024, 10_000, 20_000, 25_000, 30_000, 44_100, 1_000_000, 12_500_000, 100_000_000];
    fc.assert(
      fc.property(fc.constantFrom(...clocks), fc.double({ min: 0, max: 86_400, noNaN: true }), (clk, t) => {
        const sample = Math.floor(t * clk);
        const w = new ByteWriter();
        writeSeconds(w, sample, clk, decimalPlan(clk));
        expect(new TextDecoder().decode(w.take())).toBe(String(sample / clk));
      }),
      { numRuns: 3000, seed: 99 },
    );
    fc.assert(
      fc.property(fc.oneof(fc.nat(), fc.integer({ min: 0, max: 1e15 })), (x) => {
        const w = new ByteWriter();
        w.uint(x);
        expect(new TextDecoder().decode(w.take())).toBe(String(x));
      }),
      { numRuns: 3000, seed: 5 },
    );
    for (const [clk, s] of [[100_000_000, 1], [10_000_000, 3], [20_000, 0], [10_000, 864_000_000]] as const) {
      const w = new ByteWriter();
      writeSeconds(w, s, clk, decimalPlan(clk));
      expect(new TextDecoder().decode(w.take())).toBe(String(s / clk));
    }
  });
});

describe('CSV row bytes', () => {
  it('equal rows built with String() for every clock path (fast-check)', () => {
    const clocks = [1, 1000, 10_000, 20_000, 30_000, 1_000_000, 100_000_000];
    fc.assert(
      fc.property(
        fc.constantFrom(...clocks),
        fc.array(fc.double({ min: 0, max: 86_400, noNaN: true }), { minLength: 1, maxLength: 40 }),
        fc.nat({ max: 1e8 }),
        (clk, times, first) => {
          const samples = Float64Array.from(times.map((t) => Math.floor(t * clk)));
          const w = new ByteWriter(16);
          writeRows(w, ascii('7,'), ascii(',x\n'), samples, samples.length, first, clk, decimalPlan(clk));
          const want = [...samples].map((s, i) => `7,${first + i},${s / clk},${s},x\n`).join('');
          expect(new TextDecoder().decode(w.take())).toBe(want);
        },
      ),
      { numRuns: 400, seed: 8 },
    );
  });

  it('equal rows built with String() at digit-count edges of the index and the onset', () => {
    const clocks = [1, 1000, 10_000, 20_000, 25_000, 30_000, 1_000_000, 12_500_000, 100_000_000];
    const edges = [0, 1, 5, 9, 10, 99, 100, 999, 1000, 9999, 10_000, 10_001, 99_999, 100_000, 2 ** 31 - 1, 2 ** 31, 2 ** 32 + 7, 8_640_000_000_000];
    for (const clk of clocks) {
      for (const first of [0, 8, 95, 999_990, 9_999_995, 99_999_990, 999_999_999_995]) {
        const samples = Float64Array.from(edges);
        const w = new ByteWriter(16);
        const lines = new ByteWriter(16);
        writeRows(w, ascii('12,'), ascii(',5,mW,,,,A1\n'), samples, samples.length, first, clk, decimalPlan(clk), lines);
        const want = [...samples].map((s, i) => `12,${first + i},${s / clk},${s},5,mW,,,,A1\n`).join('');
        expect(new TextDecoder().decode(w.take())).toBe(want);
        // The checksum lines made from the same digits: the documented serialization.
        expect(new TextDecoder().decode(lines.take())).toBe([...samples].map((s) => `12,${s}\n`).join(''));
      }
    }
  });
});

describe('JSON export', () => {
  const doc = JSON.parse([...jsonChunks(electrical, { ...meta, preview: true })].join(''));
  const schedule = generateSchedule(electrical);

  it('has format, preview notice, meta, manifest, trials and stats, matching generateSchedule', () => {
    expect(Object.keys(doc)).toEqual(['format', 'preview', 'notice', 'meta', 'manifest', 'trials', 'stats']);
    expect(doc.format).toBe('pulseloom-schedule/1');
    expect(doc.notice).toBe(PREVIEW_NOTICE);
    expect(doc.meta).toEqual(meta);
    expect(doc.manifest).toEqual(schedule.manifest);
    expect(doc.trials).toEqual(schedule.trials.map(({ trial, onsetsS, onsetSamples }) => ({ trial, onsetsS, onsetSamples })));
    expect(doc.stats).toEqual(JSON.parse(JSON.stringify(schedule.stats)));
  });

  it('an approved export carries no preview fields', () => {
    const approved = JSON.parse([...jsonChunks(electrical, meta)].join(''));
    expect(approved.preview).toBeUndefined();
    expect(approved.notice).toBeUndefined();
  });
});

describe('manifest: enough to regenerate and re-check anywhere', () => {
  const m = buildManifest(optical);

  it('the checksum is SHA-256 of the documented serialization, recomputed here with node:crypto', () => {
    const s = generateSchedule(optical);
    const text = s.trials.flatMap((t) => t.onsetSamples.map((x) => `${t.trial},${x}\n`)).join('');
    expect(m.checksum).toBe(`sha256:${nodeSha(text)}`);
    expect(m.checksumOf).toMatch(/'<trial>,<onsetSample>\\n'/);
    expect(m.pulseCount).toBe(s.stats.realizedCount.total);
  });

  it('names the engine, the RNG and the seed derivation, and hashes the canonical spec', () => {
    expect(m.engineVersion).toBe('pulseloom-thinning/1');
    expect(m.rng).toBe('seedrandom@3.0.5 alea');
    expect(m.seedDerivation).toContain("sha256(utf8(masterSeed + '\\u0000' + trial + '\\u0000' + block))");
    expect(m.specSha256).toBe(`sha256:${nodeSha(JSON.stringify(m.spec))}`);
    // Key order in the input does not change the canonical spec.
    const shuffled = Object.fromEntries(Object.entries(optical).reverse()) as Spec;
    expect(buildManifest(shuffled)).toEqual(m);
  });

  it('block seeds follow the stated derivation (node:crypto) and the inlined Alea steps equal seedrandom.alea', () => {
    expect(blockSeed('vole', 3, 7)).toBe(nodeSha('vole\u00003\u00007'));
    const st = blockAleaState('vole', 3, 7);
    const ref = seedrandom.alea(blockSeed('vole', 3, 7));
    for (let i = 0; i < 10_000; i++) expect(aleaNext(st)).toBe(ref());
  });

  it('the pure SHA-256 matches the FIPS 180-2 example digests and node:crypto', () => {
    expect(sha256Hex('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
    for (let n = 0; n < 200; n += 7) {
      const s = 'µ'.repeat(n % 5) + 'x'.repeat(n);
      expect(sha256Hex(s)).toBe(nodeSha(s));
    }
  });
});

describe('verify', () => {
  const csv = [...csvLines(optical, meta)].join('');
  const json = [...jsonChunks(electrical, meta)].join('');

  it('accepts untouched CSV and JSON files, also with Windows line endings', () => {
    const a = verifySchedule(csv);
    const b = verifySchedule(json);
    expect(a).toEqual({ ok: true, pulses: generateSchedule(optical).stats.realizedCount.total, checksum: buildManifest(optical).checksum, preview: false });
    expect(verifySchedule([...csvLines(optical, { preview: true })].join(''))).toMatchObject({ ok: true, preview: true });
    expect(b.ok).toBe(true);
    expect(verifySchedule(csv.replace(/\n/g, '\r\n')).ok).toBe(true);
  });

  const firstDiff = (text: string) => {
    const r = verifySchedule(text);
    expect(r.ok).toBe(false);
    return r.ok ? '' : r.firstDifference;
  };

  it('reports the first moved pulse', () => {
    const tampered = csv.replace(/\n2,4,([^,]*),(\d+),/, (_m, s, n) => `\n2,4,${s},${Number(n) + 1},`);
    expect(firstDiff(tampered)).toMatch(/^trial 2, pulse 4: file onset_sample \d+, regenerated \d+$/);
  });

  it('reports a changed amplitude, a removed row, a forged checksum, a stale spec hash and an unknown engine', () => {
    expect(firstDiff(csv.replace(/\n1,0,([^,]*),(\d+),8,6\.5,/, '\n1,0,$1,$2,8,9.5,'))).toMatch(/trial 1, pulse 0: pulse columns/);
    expect(firstDiff(csv.replace(/\n0,3,[^\n]*/, ''))).toMatch(/trial 0/);
    expect(firstDiff(csv.replace(/# checksum: sha256:[0-9a-f]{4}/, '# checksum: sha256:0000'))).toMatch(/header "# checksum"/);
    const doc = JSON.parse(json);
    doc.manifest.spec.seed = 'other';
    expect(firstDiff(JSON.stringify(doc))).toMatch(/specSha256/);
    const doc2 = JSON.parse(json);
    doc2.manifest.engineVersion = 'pulseloom-thinning/9';
    expect(firstDiff(JSON.stringify(doc2))).toMatch(/not available here/);
    const doc3 = JSON.parse(json);
    doc3.trials[1].onsetsS[2] += 1e-9;
    expect(firstDiff(JSON.stringify(doc3))).toMatch(/trial 1, pulse 2: file onset_s/);
  });

  it('returns an error, never throws, on garbage', () => {
    for (const g of ['', 'hello', '{', '{"format":"pulseloom-schedule/1"}', '# format: pulseloom-schedule/1\n', '{"format":"pulseloom-schedule/1","manifest":null,"trials":[]}']) {
      expect(() => verifySchedule(g)).not.toThrow();
      expect(verifySchedule(g).ok).toBe(false);
    }
    expect(readScheduleFile('nonsense')).toEqual({ ok: false, firstDifference: expect.stringMatching(/not a Pulseloom schedule/) });
  });
});
