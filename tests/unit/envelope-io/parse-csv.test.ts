import { describe, expect, it } from 'vitest';
import { CSV_LIMITS, parseEnvelopeCsv } from '@/lib/envelope-io';

describe('parseEnvelopeCsv: good files', () => {
  it('reads a file with a header row', () => {
    const r = parseEnvelopeCsv('time_s,rate_hz\n0,5\n10,40\n30,20\n');
    expect(r.ok).toBe(true);
    expect(r.hasHeader).toBe(true);
    expect(r.points).toEqual([
      { t: 0, hz: 5 },
      { t: 10, hz: 40 },
      { t: 30, hz: 20 },
    ]);
    expect(r.errors).toEqual([]);
    expect(r.simplified).toEqual({ from: 3, to: 3, maxRateErrorHz: 0 });
  });

  it('reads a file without a header', () => {
    const r = parseEnvelopeCsv('0,5\n2.5,7.25\n');
    expect(r).toMatchObject({ ok: true, hasHeader: false, points: [{ t: 0, hz: 5 }, { t: 2.5, hz: 7.25 }] });
  });

  it('reads semicolons, CRLF, a byte-order mark, spaces and blank lines', () => {
    const r = parseEnvelopeCsv('\uFEFFtime_s ; rate_hz\r\n0;5\r\n\r\n 1.5 ; 6e1 \r\n3;.5\r\n');
    expect(r.ok).toBe(true);
    expect(r.delimiter).toBe(';');
    expect(r.points).toEqual([
      { t: 0, hz: 5 },
      { t: 1.5, hz: 60 },
      { t: 3, hz: 0.5 },
    ]);
  });

  it('accepts one repeated time as a step, in file order', () => {
    const r = parseEnvelopeCsv('0,10\n5,10\n5,30\n8,30\n');
    expect(r.ok).toBe(true);
    expect(r.points.map((p) => p.hz)).toEqual([10, 10, 30, 30]);
  });
});

describe('parseEnvelopeCsv: bad rows, each with its line number and reason', () => {
  const file = [
    'time_s,rate_hz', // 1
    '0,5', // 2
    '1,6,7', // 3 three fields (a decimal comma in a comma file)
    '2', // 4 one field
    '3,', // 5 empty rate
    'abc,4', // 6 not a number
    '4,-2', // 7 negative rate
    '-1,2', // 8 negative time
    '5,1e999', // 9 not finite
    '', // 10 blank: skipped, not an error
    '6,8', // 11 good
    '5.5,9', // 12 earlier than line 11
    '6,9', // 13 good: step
    '6,10', // 14 third time at 6 s
    '7,0x10', // 15 hex is not a decimal number
  ].join('\n');
  const r = parseEnvelopeCsv(file);

  it('is not ok and keeps the good rows', () => {
    expect(r.ok).toBe(false);
    expect(r.points).toEqual([
      { t: 0, hz: 5 },
      { t: 6, hz: 8 },
      { t: 6, hz: 9 },
    ]);
  });

  it('names each bad line', () => {
    expect(r.errors.map((e) => e.line)).toEqual([3, 4, 5, 6, 7, 8, 9, 12, 14, 15]);
  });

  it('says what is wrong', () => {
    const reason = (line: number) => r.errors.find((e) => e.line === line)!.reason;
    expect(reason(3)).toMatch(/found 3.*decimal comma/);
    expect(reason(4)).toMatch(/Expected 2 fields.*found 1/);
    expect(reason(5)).toMatch(/rate_hz is empty/);
    expect(reason(6)).toMatch(/time_s "abc" is not a number/);
    expect(reason(7)).toMatch(/rate_hz must be 0 or more/);
    expect(reason(8)).toMatch(/time_s must be 0 or more/);
    expect(reason(9)).toMatch(/too large/);
    expect(reason(12)).toMatch(/earlier than 6 on line 11/);
    expect(reason(14)).toMatch(/third time/);
    expect(reason(15)).toMatch(/not a number/);
  });

  it('reports a decimal comma in a semicolon file as such', () => {
    const s = parseEnvelopeCsv('time_s;rate_hz\n0;5\n1,5;6\n');
    expect(s.errors).toEqual([{ line: 3, reason: expect.stringMatching(/time_s "1,5" uses a decimal comma/) }]);
  });

  it('counts line numbers through quoted fields and CRLF', () => {
    const s = parseEnvelopeCsv('0,5\r\n"1",6\r\nx,7\r\n');
    expect(s.errors.map((e) => e.line)).toEqual([3]);
  });

  it('lists at most maxListedErrors rows and counts the rest', () => {
    const many = ['0,1', ...Array.from({ length: 80 }, () => 'bad,row')].join('\n');
    const s = parseEnvelopeCsv(many, { maxListedErrors: 10 });
    expect(s.errors).toHaveLength(10);
    expect(s.moreErrors).toBe(70);
    expect(s.errors[9].line).toBe(11);
  });

  it('needs at least two rows', () => {
    expect(parseEnvelopeCsv('time_s,rate_hz\n0,5\n').errors).toEqual([{ line: 0, reason: expect.stringMatching(/at least two rows/) }]);
    expect(parseEnvelopeCsv('').ok).toBe(false);
  });
});

describe('parseEnvelopeCsv: file limits', () => {
  it('refuses a file over the byte limit before reading rows', () => {
    const r = parseEnvelopeCsv('0,5\n1,6\n', { maxBytes: 7 });
    expect(r).toMatchObject({ ok: false, points: [], dataRows: 0 });
    expect(r.errors).toEqual([{ line: 0, reason: expect.stringMatching(/larger than the 7 bytes limit/) }]);
  });

  it('counts bytes, not characters (µ is two bytes in UTF-8)', () => {
    const text = 'time_s,rate_µ\n0,1\n1,2\n';
    expect(parseEnvelopeCsv(text, { maxBytes: text.length }).ok).toBe(false);
    expect(parseEnvelopeCsv(text, { maxBytes: text.length + 1 }).ok).toBe(true);
  });

  it('refuses a file over the default 5 MB', () => {
    const row = '123.456789,42.123456\n';
    const text = row.repeat(Math.ceil(CSV_LIMITS.maxBytes / row.length) + 1);
    const r = parseEnvelopeCsv(text);
    expect(r.ok).toBe(false);
    expect(r.errors[0].reason).toMatch(/5 MB/);
  });

  it('refuses more data rows than the row limit (the header does not count)', () => {
    const rows = (n: number) => ['time_s,rate_hz', ...Array.from({ length: n }, (_, i) => `${i},1`)].join('\n');
    expect(parseEnvelopeCsv(rows(100), { maxRows: 100 }).ok).toBe(true);
    const r = parseEnvelopeCsv(rows(101), { maxRows: 100 });
    expect(r.ok).toBe(false);
    expect(r.errors).toEqual([{ line: 0, reason: 'The file has more than 100 data rows.' }]);
  });
});
