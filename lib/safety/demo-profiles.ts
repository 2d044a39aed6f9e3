import type { Modality } from '../schedule/spec';
import type { LimitProfile } from './profile';

// Invented starting points for demo data and new labs. They are NOT recommendations:
// each lab's safety officer sets its own. Every number says where it comes from, with
// the facts-list tag: (a) published, (b) from memory, (c) common practice, no source.

export const DEMO_OPTICAL_PROFILE: LimitProfile = {
  name: 'Demo optical limits (ChR2-type, 473 nm)',
  modality: 'optical',
  whenUnknown: 'warn',
  limits: {
    // Typical ChR2-type rates are 1-40 Hz (c); the hard line is a demo value (c).
    maxRateHz: { warn: 40, hard: 100 },
    // Demo values (c): a gap shorter than a few ms merges pulses.
    minRefractoryMs: { warn: 5, hard: 2 },
    // Demo values (c).
    window: { seconds: 1, maxPulses: { warn: 40, hard: 100 } },
    // Demo values (c).
    maxDutyCyclePct: { warn: 20, hard: 50 },
    maxTrainDurationS: { warn: 60, hard: 600 },
    // Widths of 1-20 ms are typical (c); hard line demo (c).
    maxPulseWidthMs: { warn: 20, hard: 50 },
    // 1-20 mW at the tip is typical (c); sustained 3-30 mW warmed brain 0.2-2 °C (Owen et al. 2019, (a)).
    maxPeakPowerMw: { warn: 20, hard: 30 },
    maxMeanPowerMw: { warn: 3, hard: 10 },
    // Demo values (c): 10 mW through a 200 µm core is 318 mW/mm² and passes.
    maxIrradianceMwPerMm2: { warn: 400, hard: 1000 },
    // Rises of 0.2-2 °C change spiking and behaviour (Owen et al. 2019, (a)); demo levels (c).
    maxHeatingC: { warn: 0.5, hard: 2 },
  },
};

export const DEMO_ELECTRICAL_PROFILE: LimitProfile = {
  name: 'Demo electrical limits (biphasic, macroelectrode)',
  modality: 'electrical',
  whenUnknown: 'warn',
  limits: {
    // Demo values (c).
    maxRateHz: { warn: 200, hard: 500 },
    minRefractoryMs: { warn: 2, hard: 1 },
    window: { seconds: 1, maxPulses: { warn: 200, hard: 400 } },
    maxDutyCyclePct: { warn: 5, hard: 20 },
    maxTrainDurationS: { warn: 60, hard: 600 },
    // Shannon's pooled data used 400 µs phases (Shannon 1992, (a)); hard line demo (c).
    maxPhaseWidthUs: { warn: 400, hard: 1000 },
    // Demo values (c); McCreery et al. 1990 tested 0.05-5 µC/phase (a).
    maxChargePerPhaseNc: { warn: 30, hard: 100 },
    // 30 µC/cm² for clinical macroelectrodes (b, low confidence); platinum's reversible
    // injection limit is roughly 50-150 µC/cm² (Merrill et al. 2005, (b)).
    maxChargeDensityUcPerCm2: { warn: 30, hard: 100 },
    // k 1.5 as a conservative design limit (b, low confidence); 1.75 stays below 1.85,
    // the lowest k with damage in Shannon's pooled data (Shannon 1992, (a)).
    maxShannonK: { warn: 1.5, hard: 1.75 },
  },
};

export function demoProfileFor(modality: Modality): LimitProfile {
  return modality === 'optical' ? DEMO_OPTICAL_PROFILE : DEMO_ELECTRICAL_PROFILE;
}
