export type { TracePoint } from './trace';
export { parseEnvelopeCsv, CSV_LIMITS, formatBytes, type CsvRowError, type ParseCsvOptions, type ParseCsvResult } from './parse-csv';
export { simplifyTrace, maxRateError, type SimplifyReport } from './simplify';
export { pointsToEnvelope, envelopeToPoints, type LeadIn } from './points';
export { envelopeToCsv, envelopeToSpecJson } from './export';
