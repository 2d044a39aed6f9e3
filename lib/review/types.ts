import type { SafetySheet, ScheduleSummary } from '@/lib/safety';

/** Which limits a sheet was checked against. 'demo': the lab has no profile for this modality. */
export type SheetProfileInfo = { id: string | null; name: string; scope: 'rig' | 'lab' | 'demo'; rigName: string | null };

export type ReviewSafetySheet = SafetySheet & {
  profile: SheetProfileInfo;
  /**
   * What was measured on the generated schedule. `measured: false` when the schedule
   * was too large to generate for the sheet: rows then use bounds from the spec.
   */
  schedule: ScheduleSummary & { measured: boolean; expectedPulses: number };
};
