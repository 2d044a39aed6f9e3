import Papa from 'papaparse';
import type { TracePoint } from './trace';
import { simplifyTrace, type SimplifyReport } from './simplify';

/** Limits stated to the user next to the upload field. */
export const CSV_LIMITS = {
  maxBytes: 5 * 1024 * 1024,
  maxRows: 200_000,
  /** Breakpoints kept after simplification: enough detail, and the editor stays fast. */
  maxPoints: 2_000,
  /** Bad rows listed one by one; the rest are only counted. */
  maxListedErrors: 50,
} as const;

export interface CsvRowError {
  /** 1-based line in the file; 0 means the file as a whole. */
  line: number;
  reason: string;
}

export interface ParseCsvOptions {
  maxBytes?: number;
  maxRows?: number;
  maxPoints?: number;
  maxListedErrors?: number;
}

export interface ParseCsvResult {
  ok: boolean;
  /** Valid rows in file order, simplified when there were more than maxPoints. Empty when a file-level limit failed. */
  points: TracePoint[];
  errors: CsvRowError[];
  /** Bad rows beyond those listed in `errors`. */
  moreErrors: number;
  hasHeader: boolean;
  delimiter: ',' | ';';
  dataRows: number;
  simplified: SimplifyReport;
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

/**
 * Reads a rate trace of `time_s,rate_hz` rows. Header row optional; comma or semicolon
 * between fields; decimal point only (a decimal comma is reported, not guessed at, since
 * "1,5" is ambiguous in a comma-separated file). Times must not decrease; one time may
 * appear twice to mark a step.
 */
export function parseEnvelopeCsv(text: string, options: ParseCsvOptions = {}): ParseCsvResult {
  const maxBytes = options.maxBytes ?? CSV_LIMITS.maxBytes;
  const maxRows = options.maxRows ?? CSV_LIMITS.maxRows;
  const maxPoints = options.maxPoints ?? CSV_LIMITS.maxPoints;
  const maxListed = options.maxListedErrors ?? CSV_LIMITS.maxListedErrors;

  const result: ParseCsvResult = {
    ok: false,
    points: [],
    errors: [],
    moreErrors: 0,
    hasHeader: false,
    delimiter: ',',
    dataRows: 0,
    simplified: { from: 0, to: 0, maxRateErrorHz: 0 },
  };
  const fileError = (reason: string) => {
    result.errors = [{ line: 0, reason }];
    return result;
  };

  const bytes = utf8Length(text, maxBytes);
  if (bytes > maxBytes) return fileError(`The file is larger than the ${formatBytes(maxBytes)} limit.`);
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);

  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  result.delimiter = firstLine.includes(';') ? ';' : ',';

  const lineStarts = [0];
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) lineStarts.push(i + 1);
  const lineAt = (offset: number) => {
    let lo = 0;
    let hi = lineStarts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lineStarts[mid] <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };

  const points: TracePoint[] = [];
  const pointLines: number[] = [];
  let badRows = 0;
  const bad = (line: number, reason: string) => {
    badRows++;
    if (result.errors.length < maxListed) result.errors.push({ line, reason });
  };

  let rowStart = 0;
  let seenContent = false;
  let tooMany = false;
  Papa.parse<string[]>(text, {
    delimiter: result.delimiter,
    skipEmptyLines: false,
    step: (row, parser) => {
      const line = lineAt(rowStart);
      rowStart = row.meta.cursor;
      const fields = row.data.map((f) => f.trim());
      if (fields.every((f) => f === '')) return;

      if (!seenContent) {
        seenContent = true;
        if (fields.length === 2 && !NUMBER.test(fields[0]) && !NUMBER.test(fields[1]) && !DECIMAL_COMMA.test(fields[0])) {
          result.hasHeader = true;
          return;
        }
      }
      result.dataRows++;
      if (result.dataRows > maxRows) {
        tooMany = true;
        parser.abort();
        return;
      }
      const point = readRow(fields, result.delimiter, (reason) => bad(line, reason));
      if (!point) return;

      const n = points.length;
      if (n > 0 && point.t < points[n - 1].t) {
        bad(line, `time_s ${fields[0]} is earlier than ${points[n - 1].t} on line ${pointLines[n - 1]}; times must not decrease.`);
        return;
      }
      if (n > 1 && point.t === points[n - 1].t && point.t === points[n - 2].t) {
        bad(line, `time_s ${fields[0]} appears a third time; a time may appear twice at most (a step).`);
        return;
      }
      points.push(point);
      pointLines.push(line);
    },
  });

  if (tooMany) return fileError(`The file has more than ${maxRows.toLocaleString('en-US')} data rows.`);
  result.moreErrors = badRows - result.errors.length;
  if (badRows === 0 && points.length < 2) {
    result.errors.push({ line: 0, reason: 'The file needs at least two rows of time_s,rate_hz.' });
  }
  if (result.errors.length > 0) {
    result.points = points;
    result.simplified = { from: points.length, to: points.length, maxRateErrorHz: 0 };
    return result;
  }
  const { points: kept, report } = simplifyTrace(points, maxPoints);
  result.ok = true;
  result.points = kept;
  result.simplified = report;
  return result;
}

function readRow(fields: string[], delimiter: ',' | ';', report: (reason: string) => void): TracePoint | null {
  if (fields.length !== 2) {
    // With commas as separators a decimal comma shows up as extra fields.
    const hint = delimiter === ',' && fields.length === 3 ? ' (a decimal comma? use a decimal point)' : '';
    report(`Expected 2 fields (time_s${delimiter}rate_hz), found ${fields.length}${hint}.`);
    return null;
  }
  const t = readNumber(fields[0], 'time_s', report);
  if (t === null) return null;
  const hz = readNumber(fields[1], 'rate_hz', report);
  if (hz === null) return null;
  if (t < 0) {
    report(`time_s must be 0 or more, found ${fields[0]}.`);
    return null;
  }
  if (hz < 0) {
    report(`rate_hz must be 0 or more, found ${fields[1]}.`);
    return null;
  }
  return { t, hz };
}

function readNumber(field: string, name: string, report: (reason: string) => void): number | null {
  if (field === '') {
    report(`${name} is empty.`);
    return null;
  }
  if (DECIMAL_COMMA.test(field)) {
    report(`${name} "${field}" uses a decimal comma; use a decimal point.`);
    return null;
  }
  if (!NUMBER.test(field)) {
    report(`${name} "${truncate(field)}" is not a number.`);
    return null;
  }
  const value = Number(field);
  if (!Number.isFinite(value)) {
    report(`${name} "${truncate(field)}" is too large.`);
    return null;
  }
  return value;
}

/** UTF-8 byte count, stopping early once past `limit` so a huge paste costs little. */
function utf8Length(text: string, limit: number): number {
  if (text.length > limit) return text.length;
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      bytes += 4;
      i++;
    } else bytes += 3;
    if (bytes > limit) return bytes;
  }
  return bytes;
}

export function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${+(n / (1024 * 1024)).toFixed(1)} MB`;
  if (n >= 1024) return `${+(n / 1024).toFixed(1)} kB`;
  return `${n} bytes`;
}

function truncate(s: string): string {
  return s.length > 24 ? `${s.slice(0, 24)}…` : s;
}
