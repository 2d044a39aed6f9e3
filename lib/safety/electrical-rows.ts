import type { Spec } from '../schedule/spec';
import type { RigSafetyData } from './context';
import {
  MICROELECTRODE_BELOW_MM2,
  chargeDensity,
  chargePerPhase,
  isMicroelectrode,
  mm2ToCm2,
  shannonK,
  shannonMaxDensity,
} from './metrics';
import type { ElectricalLimits } from './profile';
import { checkedRow, fmt, infoRow, positive, type SheetRow } from './row';
import { SOURCES } from './sources';

const LAB = SOURCES.labLimit;

export function electricalRows(
  spec: Spec,
  rig: RigSafetyData | null,
  limits: ElectricalLimits,
  whenUnknown: 'warn' | 'fail',
): { rows: SheetRow[]; microelectrode: boolean } {
  const phaseUs = positive(spec.pulse.phases?.widthUs);
  const q = phaseUs !== null ? chargePerPhase(spec.pulse.amplitude, phaseUs) : null;
  const areaMm2 = positive(rig?.electrodeAreaMm2);
  const areaCm2 = areaMm2 !== null ? mm2ToCm2(areaMm2) : null;
  const density = q !== null && areaCm2 !== null ? chargeDensity(q.uC, areaCm2) : null;
  const micro = areaMm2 !== null && isMicroelectrode(areaMm2);
  const material = rig?.electrodeMaterial ? ` (${rig.electrodeMaterial})` : '';
  const noArea = 'Cannot be computed: the rig record has no electrode area.';
  const noPhase = 'Cannot be computed: the pulse has no phase width.';

  const rows: SheetRow[] = [
    checkedRow(
      {
        id: 'phase-width',
        label: 'Phase width',
        value: phaseUs,
        unit: 'µs',
        limit: limits.maxPhaseWidthUs,
        direction: 'max',
        source: `${SOURCES.practice}; ${LAB}`,
        help: 'Width of one phase of the biphasic pulse. Shannon’s pooled data used 400 µs phases (Shannon 1992, (a)).',
      },
      whenUnknown,
    ),
    checkedRow(
      {
        id: 'charge-per-phase',
        label: 'Charge per phase',
        value: q?.nC ?? null,
        unit: 'nC',
        limit: limits.maxChargePerPhaseNc,
        direction: 'max',
        source: `Q = I × t_phase, arithmetic (c); ${SOURCES.mccreery1990}; ${LAB}`,
        help:
          q === null
            ? noPhase
            : `${fmt(spec.pulse.amplitude)} µA × ${fmt(phaseUs as number)} µs = ${fmt(q.nC)} nC (µA × µs = pC). ` +
              'Both phases carry the same current for the same time, so each pulse is charge-balanced by construction.',
      },
      whenUnknown,
    ),
    checkedRow(
      {
        id: 'charge-density',
        label: 'Charge density per phase',
        value: density,
        unit: 'µC/cm²',
        limit: limits.maxChargeDensityUcPerCm2,
        direction: 'max',
        source: `D = Q / A, arithmetic (c); ${SOURCES.merrill2005}; ${LAB}`,
        help:
          areaCm2 === null
            ? noArea
            : q === null
              ? noPhase
              : `Charge per phase over the electrode’s geometric area${material}, ${fmt(areaMm2 as number)} mm² = ${fmt(areaCm2)} cm². ` +
                'Reversible charge injection is roughly 50–150 µC/cm² for platinum and in the mC/cm² range for iridium oxide (Merrill et al. 2005, (b)).',
      },
      whenUnknown,
    ),
  ];

  rows.push(shannonRow(q?.uC ?? null, density, areaCm2, micro, limits, whenUnknown, areaCm2 === null ? noArea : noPhase));

  rows.push(
    infoRow(
      {
        id: 'electrode-size',
        label: micro ? 'Microelectrode: justify separately' : 'Electrode geometric area',
        value: areaMm2,
        unit: 'mm²',
        source: `${SOURCES.cogan2016}; ${SOURCES.cogan2016Threshold}`,
        help:
          areaMm2 === null
            ? 'Unknown: the rig record has no electrode area, so the electrode cannot be classed.'
            : micro
              ? `Below ${MICROELECTRODE_BELOW_MM2} mm² (10 000 µm²). The Shannon criterion does not hold for microelectrodes, where damage also depends on rate, duty cycle, current density and size. Submit with a written justification.`
              : `At least ${MICROELECTRODE_BELOW_MM2} mm²: a macroelectrode, to which the Shannon criterion applies.`,
      },
      micro ? 'warn' : 'info',
    ),
  );

  return { rows, microelectrode: micro };
}

function shannonRow(
  qUc: number | null,
  density: number | null,
  areaCm2: number | null,
  micro: boolean,
  limits: ElectricalLimits,
  whenUnknown: 'warn' | 'fail',
  missing: string,
): SheetRow {
  const base = { id: 'shannon-k', label: 'Shannon k', unit: '', source: `${SOURCES.shannon1992}; ${LAB}` };
  // No charge at all has k = −∞: nothing to check, and not a missing value either.
  if (qUc === 0) return infoRow({ ...base, value: null, help: 'No charge is delivered (amplitude 0).' });
  const k = qUc !== null && density !== null ? shannonK(qUc, density) : null;
  const kLimit = limits.maxShannonK?.hard ?? limits.maxShannonK?.warn;
  const headroom =
    k !== null && kLimit !== undefined && areaCm2 !== null
      ? ` On this electrode, k ${fmt(kLimit)} allows up to ${fmt(shannonMaxDensity(kLimit, areaCm2))} µC/cm² per phase.`
      : '';
  return checkedRow(
    {
      ...base,
      value: k,
      limit: limits.maxShannonK,
      direction: 'max',
      help:
        k === null
          ? missing
          : 'k = log10(Q) + log10(D), Q in µC per phase, D in µC/cm² per phase. Damage appeared from k 1.85 in the pooled data ' +
            '(cat cortex, 50 pulses/s, 400 µs phases, 7 h; Shannon 1992, (a)); rate, width, duty cycle and exposure are not in the model.' +
            headroom +
            (micro ? ' This is a microelectrode: the criterion does not hold here (Cogan et al. 2016, (a)).' : ''),
    },
    whenUnknown,
  );
}
