/**
 * Pulseloom's schedule engine: spec → seeded pulse onsets, statistics, manifest, exports.
 * Pure functions, no framework. spec.ts and envelope.ts are browser-safe on their own;
 * this index also pulls in node:crypto (checksums), so import it on the server.
 */
export * from './spec';
export * from './envelope';
export { generateSchedule, type Schedule, type TrialSchedule } from './generate';
export {
  streamPulses,
  streamBlock,
  blockTicks,
  trialBlocks,
  type Pulse,
  type StreamOptions,
  type BlockResult,
  type BlockChunk,
} from './stream';
export { buildManifest, scanSchedule, MANIFEST_FORMAT, type Manifest, type ScanResult } from './manifest';
export { verifySchedule, readScheduleFile, type ScheduleFile, type VerifyResult, type ReadResult } from './verify';
export { SHORTFALL_WARNING, type ScheduleStats, type TrialStats, type Suppressed } from './stats';
export { canonicalSpec, canonicalSpecJson } from './canonical';
export { CHECKSUM_OF } from './checksum';
export { ENGINE_ID, SUPPORTED_ENGINES, ENGINE_METHOD } from './engine';
export { RNG_ALGORITHM, SEED_DERIVATION, BLOCK_SECONDS, blockSeed } from './seeds';
export { SpecInvalidError, assertValid } from './validate';
export { csvBytes, csvLines, csvRowBytes, CSV_COLUMNS, CSV_HEADER } from './export/csv';
export { jsonBytes, jsonChunks } from './export/json';
export { SCHEDULE_FORMAT, PREVIEW_NOTICE, type ScheduleMeta, type MetaValue } from './export/meta';
export { ScheduleMismatchError, type KnownSchedule, type ExportOptions } from './export/known';
