import { modalityOf, type Modality, type Spec } from '../schedule/spec';
import { SAFETY_DISCLAIMER, cautionsFor, type Caution } from './cautions';
import { derive, type RigSafetyData, type ScheduleSummary } from './context';
import { electricalRows } from './electrical-rows';
import { opticalRows } from './optical-rows';
import type { LimitProfile } from './profile';
import type { SheetRow } from './row';
import { timingRows } from './timing-rows';

export interface SafetySheetInput {
  /** A parsed spec (specSchema). */
  spec: Spec;
  profile: LimitProfile;
  /** The rig the version targets; null when none is chosen yet. */
  rig?: RigSafetyData | null;
  /** Numbers measured on the generated schedule; omit when there is no preview yet. */
  schedule?: ScheduleSummary | null;
}

export interface SafetySheet {
  modality: Modality;
  rows: SheetRow[];
  /** False when any row fails a hard limit. */
  canSubmit: boolean;
  /** True when any row is at warning level: submission needs a written justification. */
  needsJustification: boolean;
  flags: { microelectrode: boolean };
  cautions: Caution[];
  disclaimer: string;
}

export function buildSafetySheet({ spec, profile, rig = null, schedule = null }: SafetySheetInput): SafetySheet {
  const modality = modalityOf(spec);
  const whenUnknown = profile.whenUnknown ?? 'warn';
  const rows: SheetRow[] = [];
  let microelectrode = false;

  const rigMatches = !rig || rig.modality === modality;
  if (!rigMatches) rows.push(mismatchRow('rig-modality', `The rig is ${rig?.modality} but the spec is ${modality}.`));

  if (profile.modality !== modality) {
    // Limits written for another modality say nothing about this spec: checking it
    // against them would pass it unseen, so the sheet stops here.
    rows.push(mismatchRow('profile-modality', `The limit profile is ${profile.modality} but the spec is ${modality}.`));
  } else {
    const usedRig = rigMatches ? rig : null;
    const d = derive(spec, schedule);
    rows.push(...timingRows(spec, d, schedule, profile.limits, whenUnknown));
    if (profile.modality === 'optical') {
      rows.push(...opticalRows(spec, d, usedRig, profile.limits, whenUnknown));
    } else {
      const electrical = electricalRows(spec, usedRig, profile.limits, whenUnknown);
      rows.push(...electrical.rows);
      microelectrode = electrical.microelectrode;
    }
  }

  return {
    modality,
    rows,
    canSubmit: !rows.some((r) => r.status === 'fail'),
    needsJustification: rows.some((r) => r.status === 'warn'),
    flags: { microelectrode },
    cautions: cautionsFor(modality),
    disclaimer: SAFETY_DISCLAIMER,
  };
}

function mismatchRow(id: string, help: string): SheetRow {
  return {
    id,
    label: 'Modality matches',
    value: null,
    unit: '',
    limit: null,
    direction: null,
    margin: null,
    status: 'fail',
    source: 'Consistency check (c)',
    help: `${help} Choose a matching rig and limit profile.`,
  };
}
