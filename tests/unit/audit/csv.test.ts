import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { AUDIT_CSV_COLUMNS, AUDIT_CSV_HEADER, auditCsvLine, csvField } from '@/lib/audit/csv';

// papaparse (a general-purpose CSV reader) is the reference: what we write must read
// back field for field.

const row = {
  id: 7,
  at: new Date('2031-04-30T09:15:00.123Z'),
  actorLabel: 'tomas.reyes@harborlane.test',
  actorUserId: '00000000-0000-4000-8000-000000000001',
  actorTokenId: null,
  action: 'version.approved',
  subjectType: 'protocol_version',
  subjectId: 'abc',
  checksum: 'sha256:00ff',
  ip: '10.0.0.5',
  details: { note: 'said "fine", then left\nearly', n: 3 },
};

describe('audit CSV', () => {
  it('quotes commas, quotes and line breaks so a reader gets the fields back', () => {
    const text = AUDIT_CSV_HEADER + auditCsvLine(row);
    const parsed = Papa.parse<string[]>(text.trimEnd(), { newline: '\r\n' });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data[0]).toEqual([...AUDIT_CSV_COLUMNS]);
    const back = Object.fromEntries(AUDIT_CSV_COLUMNS.map((c, i) => [c, parsed.data[1]![i]]));
    expect(back.at).toBe('2031-04-30T09:15:00.123Z');
    expect(back.actor_token_id).toBe('');
    expect(JSON.parse(back.details!)).toEqual(row.details);
  });

  it('doubles quotes inside a quoted field (RFC 4180 §2.7)', () => {
    expect(csvField('a "b" c')).toBe('"a ""b"" c"');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('plain')).toBe('plain');
    expect(csvField(null)).toBe('');
  });

  it('defuses text a spreadsheet would run as a formula', () => {
    expect(csvField('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvField('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvField('+1')).toBe("'+1");
    // Numbers are numbers, not text a person typed.
    expect(csvField(-3)).toBe('-3');
  });

  it('ends every line with CRLF', () => {
    expect(AUDIT_CSV_HEADER.endsWith('\r\n')).toBe(true);
    expect(auditCsvLine(row).match(/\r\n$/)).not.toBeNull();
  });
});
