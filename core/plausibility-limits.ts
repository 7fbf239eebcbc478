/**
 * Ranges outside which a sample is flagged `suspect` (values still returned).
 * Common practice, not a published standard: they bracket the usual sedimentary rocks,
 * evaporites and borehole fluids (water and mud near 1.0–1.3 g/cm3 and ~1500 m/s, dolomite
 * near 2.87 g/cm3 and ~7000 m/s). Requests may override each bound.
 */
export interface PlausibilityLimits {
  rhoMinGramsPerCubicCentimetre: number;
  rhoMaxGramsPerCubicCentimetre: number;
  vpMinMetresPerSecond: number;
  vpMaxMetresPerSecond: number;
  vsMinMetresPerSecond: number;
  vsMaxMetresPerSecond: number;
  /** Vp/Vs above this (3.0 means Poisson's ratio about 0.44) is flagged `vp_vs_high`. */
  vpVsMax: number;
}

export const DEFAULT_PLAUSIBILITY_LIMITS: Readonly<PlausibilityLimits> = Object.freeze({
  rhoMinGramsPerCubicCentimetre: 1.0,
  rhoMaxGramsPerCubicCentimetre: 3.1,
  vpMinMetresPerSecond: 1300,
  vpMaxMetresPerSecond: 7500,
  vsMinMetresPerSecond: 250,
  vsMaxMetresPerSecond: 4500,
  vpVsMax: 3.0,
});

export const withDefaultLimits = (overrides: Partial<PlausibilityLimits> = {}): PlausibilityLimits => {
  const limits: PlausibilityLimits = { ...DEFAULT_PLAUSIBILITY_LIMITS };
  for (const key of Object.keys(limits) as (keyof PlausibilityLimits)[]) {
    const value = overrides[key];
    if (value !== undefined) limits[key] = value;
  }
  return limits;
};
