import { describe, expect, it } from 'vitest';
import {
  HEATING_C_PER_MW,
  MICROELECTRODE_BELOW_MM2,
  TISSUE,
  chargeDensity,
  chargePerPhase,
  coreAreaMm2,
  dutyCycle,
  heatingFromMeanPowerC,
  heatingUpperBoundC,
  irradianceAtTip,
  isMicroelectrode,
  meanOpticalPower,
  mm2ToCm2,
  relativeIrradianceAtDepth,
  shannonK,
  shannonMaxDensity,
} from '@/lib/safety/metrics';

// Check values come from the project's facts list; each names its published source and
// keeps its tag: (a) read in the source, (b) from memory, (c) arithmetic or practice.

describe('charge per phase, Q = I · t_phase', () => {
  it('100 µA for 200 µs is 20 nC = 0.02 µC (facts §4, worked example, (c))', () => {
    const q = chargePerPhase(100, 200);
    expect(q.nC).toBeCloseTo(20, 12);
    expect(q.uC).toBeCloseTo(0.02, 15);
  });

  it('is zero without current and doubles with the phase width (arithmetic, (c))', () => {
    expect(chargePerPhase(0, 200).nC).toBe(0);
    expect(chargePerPhase(100, 400).nC).toBeCloseTo(2 * chargePerPhase(100, 200).nC, 12);
  });
});

describe('charge density, D = Q / A', () => {
  it('converts the rig’s mm² to cm² (1 cm² = 100 mm², (c))', () => {
    expect(mm2ToCm2(6)).toBeCloseTo(0.06, 15);
    expect(mm2ToCm2(0.002)).toBeCloseTo(2e-5, 18);
  });

  it('0.02 µC on a 0.06 cm² contact is 0.3333 µC/cm² (facts §4: Q = I·t, D = Q/A, (c))', () => {
    expect(chargeDensity(0.02, 0.06)).toBeCloseTo(1 / 3, 12);
  });
});

describe('Shannon criterion, Shannon (1992) IEEE Trans. Biomed. Eng. 39(4):424-426 (a)', () => {
  // Q·D = 10^k (facts §4, computed values, (c)).
  it.each([
    [1.5, 31.62],
    [1.75, 56.23],
    [1.85, 70.79],
  ])('k %s corresponds to Q·D = %s µC²/cm²', (k, product) => {
    // Any split of the product between Q and D gives the same k.
    expect(shannonK(product, 1)).toBeCloseTo(k, 3);
    expect(shannonK(1, product)).toBeCloseTo(k, 3);
    expect(shannonK(0.5, product / 0.5)).toBeCloseTo(k, 3);
  });

  // Highest D on a 0.06 cm² macroelectrode contact (facts §4, computed, (c)).
  it.each([
    [1.5, 22.96],
    [1.75, 30.6],
    [1.85, 34.35],
  ])('k %s allows %s µC/cm² on 0.06 cm²', (k, dMax) => {
    expect(shannonMaxDensity(k, 0.06)).toBeCloseTo(dMax, dMax === 30.6 ? 1 : 2);
    // And that density, with Q = D·A, sits exactly at k.
    expect(shannonK(dMax * 0.06, dMax)).toBeCloseTo(k, 3);
  });

  it('100 µA × 200 µs on 6 mm² gives k = log10(0.02 × 0.3333) = −2.176 (arithmetic, (c))', () => {
    const q = chargePerPhase(100, 200).uC;
    expect(shannonK(q, chargeDensity(q, mm2ToCm2(6)))).toBeCloseTo(-2.1761, 4);
  });
});

describe('microelectrode threshold, Cogan et al. (2016) J. Neural Eng. 13:021001', () => {
  // The Shannon model does not hold for microelectrodes (a); the 10 000 µm² cut-off is
  // recalled from the same review (b).
  it('is 10 000 µm² = 0.01 mm²', () => {
    expect(MICROELECTRODE_BELOW_MM2).toBe(10_000 / 1e6);
  });

  it('classes areas below the cut-off as microelectrodes, at or above as macro', () => {
    expect(isMicroelectrode(0.002)).toBe(true);
    expect(isMicroelectrode(0.0099)).toBe(true);
    expect(isMicroelectrode(0.01)).toBe(false);
    expect(isMicroelectrode(6)).toBe(false);
  });
});

describe('irradiance at the fibre tip, E = P / (π r²) (facts §5, computed, (c))', () => {
  it.each([
    [10, 200, 318.3],
    [5, 200, 159.2],
    [1, 200, 31.83],
    [10, 100, 1273],
    [10, 62.5, 3259],
  ])('%s mW through a %s µm core is %s mW/mm²', (mw, um, expected) => {
    const e = irradianceAtTip(mw, um);
    expect(Math.abs(e - expected) / expected).toBeLessThan(5e-4);
  });

  it('7.5 mW through 200 µm is about 239 mW/mm² (facts §5, published practitioner note, (a))', () => {
    expect(irradianceAtTip(7.5, 200)).toBeCloseTo(239, 0);
  });

  it('uses the core radius, not the diameter: a 200 µm core has area 0.0314 mm² ((c))', () => {
    expect(coreAreaMm2(200)).toBeCloseTo(Math.PI * 0.01, 12);
  });
});

describe('duty cycle and mean optical power (facts §5: P_mean = P_peak × width × rate, (c))', () => {
  it('5 ms pulses at 20 Hz are on 10 % of the time', () => {
    expect(dutyCycle(0.005, 20)).toBeCloseTo(0.1, 12);
  });

  it('10 mW peak at 10 % duty is 1 mW mean', () => {
    expect(meanOpticalPower(10, dutyCycle(0.005, 20))).toBeCloseTo(1, 12);
  });
});

describe('heating upper bound, Yizhar et al. (2011) Neuron 71:9-34 (b)', () => {
  it('uses μa 0.1/mm, c 3650 mJ/(g·°C), ρ 0.00104 g/mm³ (facts §5, (b))', () => {
    expect(TISSUE).toEqual({ absorptionPerMm: 0.1, densityGPerMm3: 0.00104, heatCapacityMjPerGC: 3650 });
  });

  it('4.9 mW/mm², 5 ms at 20 Hz for 30 s (3 s of light) is 0.387 °C', () => {
    const lightOnS = 30 * 20 * 0.005;
    expect(lightOnS).toBeCloseTo(3, 12);
    expect(heatingUpperBoundC(4.9, lightOnS)).toBeCloseTo(0.387, 3);
  });

  it('grows linearly with light-on time, since it ignores conduction and blood flow ((c))', () => {
    expect(heatingUpperBoundC(4.9, 6)).toBeCloseTo(2 * heatingUpperBoundC(4.9, 3), 12);
  });
});

describe('heating from mean power, Shin et al. (2016) Biomed. Opt. Express 7(11):4450 (a)', () => {
  it('uses 0.25 °C/mW near the tip and 0.116 °C/mW at 563 µm', () => {
    expect(HEATING_C_PER_MW).toEqual({ nearTip: 0.25, at563um: 0.116 });
  });

  it('1 mW mean is 0.25 °C by default; 10 mW at 563 µm is 1.16 °C (arithmetic on the coefficients, (c))', () => {
    expect(heatingFromMeanPowerC(1)).toBeCloseTo(0.25, 12);
    expect(heatingFromMeanPowerC(10, HEATING_C_PER_MW.at563um)).toBeCloseTo(1.16, 12);
  });
});

describe('light spread, Aravanis et al. (2007) J. Neural Eng. 4:S143 (b; information only)', () => {
  // Facts §5, computed from the model (c): r 0.1 mm, NA 0.37, n 1.36, S 11.2/mm.
  it('gives ρ = 0.3537 mm and I/I0 = 0.0260 at 0.5 mm', () => {
    expect(relativeIrradianceAtDepth(0, 0.1, 0.37)).toBeCloseTo(1, 12);
    expect(relativeIrradianceAtDepth(0.5, 0.1, 0.37)).toBeCloseTo(0.026, 4);
  });

  it('falls monotonically with depth ((c))', () => {
    const depths = [0, 0.1, 0.25, 0.5, 1, 2];
    const values = depths.map((z) => relativeIrradianceAtDepth(z, 0.1, 0.37));
    for (let i = 1; i < values.length; i++) expect(values[i]).toBeLessThan(values[i - 1]);
  });
});
