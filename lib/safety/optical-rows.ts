import type { Spec } from '../schedule/spec';
import type { Derived, RigSafetyData } from './context';
import {
  HEATING_C_PER_MW,
  heatingFromMeanPowerC,
  heatingUpperBoundC,
  irradianceAtTip,
  meanOpticalPower,
  relativeIrradianceAtDepth,
  SPREAD,
} from './metrics';
import type { OpticalLimits } from './profile';
import { checkedRow, fmt, infoRow, positive, type SheetRow } from './row';
import { SOURCES } from './sources';

const LAB = SOURCES.labLimit;
/** Depth for the light-spread estimate: a typical distance from tip to target, (c). */
const SPREAD_DEPTH_MM = 0.5;

export function opticalRows(
  spec: Spec,
  d: Derived,
  rig: RigSafetyData | null,
  limits: OpticalLimits,
  whenUnknown: 'warn' | 'fail',
): SheetRow[] {
  const peakMw = spec.pulse.amplitude;
  const coreUm = positive(rig?.fibreCoreUm);
  const na = positive(rig?.fibreNA);
  const irradiance = coreUm !== null ? irradianceAtTip(peakMw, coreUm) : null;
  const meanMw = d.duty ? meanOpticalPower(peakMw, d.duty.fraction) : null;
  const burstMw = d.busiestDuty !== null ? meanOpticalPower(peakMw, d.busiestDuty) : null;
  const heatingC = meanMw !== null ? heatingFromMeanPowerC(meanMw) : null;
  const noCore = 'Cannot be computed: the rig record has no fibre core diameter.';
  const wavelength = positive(rig?.wavelengthNm);

  const rows: SheetRow[] = [
    checkedRow(
      {
        id: 'pulse-width',
        label: 'Light pulse width',
        value: spec.pulse.widthMs,
        unit: 'ms',
        limit: limits.maxPulseWidthMs,
        direction: 'max',
        source: `${SOURCES.practice}; ${LAB}`,
        help: 'Widths of 1–20 ms are typical for ChR2-type opsins (common practice, no source).',
      },
      whenUnknown,
    ),
    checkedRow(
      {
        id: 'peak-power',
        label: 'Peak power at the fibre tip',
        value: peakMw,
        unit: 'mW',
        limit: limits.maxPeakPowerMw,
        direction: 'max',
        source: `Pulse amplitude in the spec (c); ${LAB}`,
        help: 'The power set in the spec, which should be measured at the tip. 1–20 mW at the tip is typical (common practice, no source).',
      },
      whenUnknown,
    ),
    checkedRow(
      {
        id: 'irradiance',
        label: 'Irradiance at the fibre tip',
        value: irradiance,
        unit: 'mW/mm²',
        limit: limits.maxIrradianceMwPerMm2,
        direction: 'max',
        source: `${SOURCES.geometry}: E = P / (π r²) over the core; ${LAB}`,
        help:
          coreUm === null
            ? noCore
            : `Peak power over the area of a ${fmt(coreUm)} µm core; 10 mW through 200 µm gives 318.3 mW/mm² (c). ` +
              'Irradiance falls quickly with depth; about 1 mW/mm² half-activates ChR2-H134R and about 100 mW/mm² is cited for phototoxicity at the target (b, secondary).',
      },
      whenUnknown,
    ),
    checkedRow(
      {
        id: 'mean-power',
        label: 'Mean power, whole train',
        value: meanMw,
        unit: 'mW',
        limit: limits.maxMeanPowerMw,
        direction: 'max',
        source: `${SOURCES.practice}: heating follows average power, P_mean = P_peak × duty cycle; ${LAB}`,
        help: meanMw === null ? 'Cannot be computed: no duty cycle.' : 'Peak power × duty cycle. Sustained 3–30 mW warmed brain tissue by 0.2–2 °C (Owen et al. 2019, (a)).',
      },
      whenUnknown,
    ),
    checkedRow(
      {
        id: 'mean-power-window',
        label: 'Mean power, busiest window',
        value: burstMw,
        unit: 'mW',
        limit: limits.maxMeanPowerMw,
        direction: 'max',
        source: `${SOURCES.practice}: a random burst runs above the mean duty cycle; ${LAB}`,
        help: burstMw === null ? 'Cannot be computed: generate a preview, or give the spec a window cap.' : 'Peak power × duty cycle of the busiest window; checked against the mean-power limit.',
      },
      whenUnknown,
    ),
    checkedRow(
      {
        id: 'heating-mean',
        label: 'Temperature rise estimate from mean power',
        value: heatingC,
        unit: '°C',
        limit: limits.maxHeatingC,
        direction: 'max',
        source: `${SOURCES.shin2016}; ${LAB}`,
        help:
          heatingC === null
            ? 'Cannot be computed: no mean power.'
            : `Mean power × ${HEATING_C_PER_MW.nearTip} °C/mW, the measured rise close to the tip (0.116 °C/mW at 563 µm). ` +
              (wavelength !== null && wavelength !== 473 ? `Measured at 473 nm; at ${fmt(wavelength)} nm treat it as rough. ` : '') +
              'Rises of 0.2–2 °C change spiking and behaviour (Owen et al. 2019, (a)); irreversible damage appears at 6–8 K and models can understate heating up to tenfold (Arias-Gil et al. 2016, (a)).',
      },
      whenUnknown,
    ),
  ];

  const lightOnS = d.busiest && d.spanMs !== null ? d.busiest.pulses * (d.spanMs / 1000) : null;
  rows.push(
    infoRow({
      id: 'heating-burst-bound',
      label: 'Heating upper bound, busiest window (no conduction, no blood flow)',
      value: irradiance !== null && lightOnS !== null ? heatingUpperBoundC(irradiance, lightOnS) : null,
      unit: '°C',
      source: SOURCES.yizhar2011,
      help:
        'ΔT = E·μa·t_on / (ρ·c) with the tip irradiance and the light-on time of the busiest window, μa 0.1/mm, ' +
        'c 3650 mJ/(g·°C), ρ 0.00104 g/mm³. An UPPER BOUND, not a prediction: it assumes no heat leaves by conduction or blood flow, ' +
        'so it overstates heating, more so for longer windows.' +
        (irradiance === null ? ` ${noCore}` : lightOnS === null ? ' Cannot be computed: no busiest window.' : ''),
    }),
  );

  rows.push(
    infoRow({
      id: 'spread',
      label: `Irradiance ${SPREAD_DEPTH_MM} mm below the tip (estimate)`,
      value:
        irradiance !== null && coreUm !== null && na !== null && na < SPREAD.tissueIndex
          ? irradiance * relativeIrradianceAtDepth(SPREAD_DEPTH_MM, coreUm / 2000, na)
          : null,
      unit: 'mW/mm²',
      source: SOURCES.aravanis2007,
      help:
        `Scattering and geometric spread in mouse brain (S ${SPREAD.scatterPerMmMouse}/mm, n ${SPREAD.tissueIndex}). For orientation only: published figures built on this model disagree, so no rule uses it.` +
        (coreUm === null || na === null ? ' Needs the rig’s fibre core diameter and numerical aperture.' : ''),
    }),
  );

  return rows;
}
