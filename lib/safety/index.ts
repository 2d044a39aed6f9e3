export { CAUTIONS, SAFETY_DISCLAIMER, cautionsFor, type Caution } from './cautions';
export type { RigSafetyData, ScheduleSummary } from './context';
export { DEMO_ELECTRICAL_PROFILE, DEMO_OPTICAL_PROFILE, demoProfileFor } from './demo-profiles';
export * from './metrics';
export {
  electricalLimitsSchema,
  kLimitSchema,
  limitProfileSchema,
  maxLimitSchema,
  minLimitSchema,
  opticalLimitsSchema,
  windowLimitSchema,
  windowSecondsFor,
  type ElectricalLimits,
  type Limit,
  type LimitProfile,
  type LimitProfileInput,
  type OpticalLimits,
  type SharedLimits,
} from './profile';
export type { SheetRow } from './row';
export { buildSafetySheet, type SafetySheet, type SafetySheetInput } from './sheet';
export { SOURCES } from './sources';
export { judge, type Direction, type RowStatus, type Verdict } from './status';
