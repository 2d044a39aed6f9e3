// CSV for the audit download: RFC 4180 quoting (a field with a comma, quote, CR or LF
// is quoted; quotes inside are doubled), CRLF line ends. Text a person or a rig token
// chose (e-mails, token names, details) can begin with = + - @, which spreadsheets run
// as formulas; such fields get a leading apostrophe, the usual guard (OWASP, "CSV
// Injection"), so opening the file never executes it.

export const AUDIT_CSV_COLUMNS = [
  'id',
  'at',
  'actor',
  'actor_user_id',
  'actor_token_id',
  'action',
  'subject_type',
  'subject_id',
  'checksum',
  'ip',
  'details',
] as const;

export type AuditCsvRow = {
  id: number;
  at: Date;
  actorLabel: string;
  actorUserId: string | null;
  actorTokenId: string | null;
  action: string;
  subjectType: string;
  subjectId: string | null;
  checksum: string | null;
  ip: string | null;
  details: unknown;
};

const FORMULA_START = /^[=+\-@\t\r]/;

export function csvField(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  let s = String(value);
  if (typeof value === 'string' && FORMULA_START.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvLine(fields: readonly (string | number | null | undefined)[]): string {
  return `${fields.map(csvField).join(',')}\r\n`;
}

export const AUDIT_CSV_HEADER = csvLine(AUDIT_CSV_COLUMNS);

export function auditCsvLine(r: AuditCsvRow): string {
  return csvLine([
    r.id,
    r.at.toISOString(),
    r.actorLabel,
    r.actorUserId,
    r.actorTokenId,
    r.action,
    r.subjectType,
    r.subjectId,
    r.checksum,
    r.ip,
    JSON.stringify(r.details ?? {}),
  ]);
}
