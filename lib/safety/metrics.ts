// Pure formulas behind the safety sheet. Units are in the names because a slip
// between µC and nC, or mm² and cm², changes a safety answer by orders of magnitude.
// Sources and tags are in ./sources.ts; the facts list gives the check values.

// ---- Electrical -----------------------------------------------------------------

/** Q = I · t_phase (c). µA × µs = pC, so divide by 1000 for nC and by 10⁶ for µC. */
export function chargePerPhase(amplitudeUa: number, phaseWidthUs: number): { nC: number; uC: number } {
  const pC = amplitudeUa * phaseWidthUs;
  return { nC: pC / 1e3, uC: pC / 1e6 };
}

/** Rigs store electrode area in mm²; charge density is quoted per cm² (1 cm² = 100 mm²). */
export function mm2ToCm2(areaMm2: number): number {
  return areaMm2 / 100;
}

/** D = Q / A in µC/cm² per phase (c). */
export function chargeDensity(chargeUc: number, areaCm2: number): number {
  return chargeUc / areaCm2;
}

/** Shannon (1992): k = log10(Q) + log10(D), Q in µC/phase, D in µC/cm²/phase. */
export function shannonK(chargeUc: number, densityUcPerCm2: number): number {
  return Math.log10(chargeUc) + Math.log10(densityUcPerCm2);
}

/**
 * Highest charge density an electrode of this area may carry before k is reached.
 * With Q = D·A, Q·D = 10^k gives D = √(10^k / A). Shown in help so a user sees the
 * headroom in the unit they set on the stimulator, not only in log units.
 */
export function shannonMaxDensity(k: number, areaCm2: number): number {
  return Math.sqrt(10 ** k / areaCm2);
}

/**
 * Below this geometric area an electrode counts as a microelectrode, for which the
 * Shannon model does not hold (Cogan et al. 2016, (a)); the 10 000 µm² cut-off is
 * recalled from the same review (b).
 */
export const MICROELECTRODE_BELOW_MM2 = 0.01;

export function isMicroelectrode(areaMm2: number): boolean {
  return areaMm2 < MICROELECTRODE_BELOW_MM2;
}

// ---- Timing -----------------------------------------------------------------------

/** Fraction of time the output is on: on-time per pulse × pulse rate (c). */
export function dutyCycle(onTimeS: number, rateHz: number): number {
  return onTimeS * rateHz;
}

// ---- Optical ----------------------------------------------------------------------

/** Core area from the rig's core diameter in µm, in mm². */
export function coreAreaMm2(coreDiameterUm: number): number {
  const radiusMm = coreDiameterUm / 2 / 1000;
  return Math.PI * radiusMm * radiusMm;
}

/** E = P / (π r²) at the fibre tip, mW/mm² (c). */
export function irradianceAtTip(powerMw: number, coreDiameterUm: number): number {
  return powerMw / coreAreaMm2(coreDiameterUm);
}

/** Heating follows average power: P_mean = P_peak × duty cycle (c). */
export function meanOpticalPower(peakMw: number, duty: number): number {
  return peakMw * duty;
}

/** Tissue constants used by Yizhar et al. (2011) for the estimate below (b). */
export const TISSUE = {
  absorptionPerMm: 0.1,
  densityGPerMm3: 0.00104,
  heatCapacityMjPerGC: 3650,
} as const;

/**
 * UPPER BOUND on the temperature rise: all absorbed light stays where it is absorbed,
 * ΔT = E·μa·t_on / (ρ·c) (Yizhar et al. 2011, (b)). It ignores conduction and blood
 * flow, so it grows without limit with light-on time; it is meaningful for a burst, not
 * for a long train, and it is never a prediction.
 */
export function heatingUpperBoundC(irradianceMwPerMm2: number, lightOnS: number, tissue = TISSUE): number {
  // mW/mm² × mm⁻¹ × s = mJ/mm³; ρ·c in mJ/(mm³·°C).
  return (irradianceMwPerMm2 * tissue.absorptionPerMm * lightOnS) / (tissue.densityGPerMm3 * tissue.heatCapacityMjPerGC);
}

/**
 * Measured rise per mW of average power at 473 nm (Shin et al. 2016, (a)): 0.25 °C/mW
 * close to the tip (100 µm), 0.116 °C/mW at 563 µm. The sheet uses the larger value
 * because it must not understate heating.
 */
export const HEATING_C_PER_MW = { nearTip: 0.25, at563um: 0.116 } as const;

export function heatingFromMeanPowerC(meanPowerMw: number, cPerMw: number = HEATING_C_PER_MW.nearTip): number {
  return meanPowerMw * cPerMw;
}

/** Light-spread constants of Aravanis et al. (2007) (b). */
export const SPREAD = { tissueIndex: 1.36, scatterPerMmMouse: 11.2, scatterPerMmRat: 10.3 } as const;

/**
 * Fraction of the tip irradiance left at depth z below the tip (Aravanis et al. 2007,
 * (b)): I(z)/I0 = ρ² / ((S·z + 1)(z + ρ)²), ρ = r·√((n/NA)² − 1). Information only:
 * published numbers built on it do not agree, so no rule depends on it.
 */
export function relativeIrradianceAtDepth(
  depthMm: number,
  coreRadiusMm: number,
  numericalAperture: number,
  scatterPerMm: number = SPREAD.scatterPerMmMouse,
  tissueIndex: number = SPREAD.tissueIndex,
): number {
  const rho = coreRadiusMm * Math.sqrt((tissueIndex / numericalAperture) ** 2 - 1);
  return (rho * rho) / ((scatterPerMm * depthMm + 1) * (depthMm + rho) ** 2);
}
