import {
  computeElasticLog,
  withDefaultLimits,
  type ElasticLog,
  type ElasticLogRequest,
  type PlausibilityLimits,
} from "../../core/index.js";

/** One-call helper for core tests: velocities in m/s, density in g/cm3, moduli in GPa unless overridden. */
export const elasticOf = (
  vp: number[],
  vs: number[],
  rho: number[],
  overrides: Partial<Omit<ElasticLogRequest, "limits">> & { limits?: Partial<PlausibilityLimits> } = {},
): ElasticLog =>
  computeElasticLog({
    compressional: { measure: "velocity", unit: "m/s", values: Float64Array.from(vp) },
    shear: { measure: "velocity", unit: "m/s", values: Float64Array.from(vs) },
    density: { unit: "g/cm3", values: Float64Array.from(rho) },
    nullValue: -999.25,
    keepNegativePoisson: false,
    modulusUnit: "GPa",
    velocityUnit: "m/s",
    impedanceUnit: "m/s*g/cm3",
    ...overrides,
    limits: withDefaultLimits(overrides.limits),
  });

export const relativeError = (actual: number, expected: number): number =>
  Math.abs(actual - expected) / Math.max(Math.abs(expected), Number.MIN_VALUE);
