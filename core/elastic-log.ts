import { computeElasticSi } from "./elastic-kernel.js";
import { densityToSi, sonicToMetresPerSecond, type DensityCurve, type SonicCurve } from "./input-screening.js";
import type { PlausibilityLimits } from "./plausibility-limits.js";
import { invalidatingMask } from "./qc-flags.js";
import {
  DENSITY_UNITS,
  IMPEDANCE_UNITS,
  MODULUS_UNITS,
  VELOCITY_UNITS,
  type ImpedanceUnit,
  type ModulusUnit,
  type VelocityUnit,
} from "./units.js";

export interface ElasticLogRequest {
  compressional: SonicCurve;
  shear: SonicCurve;
  density: DensityCurve;
  /** A raw value equal to this is absent (LAS convention, usually −999.25). */
  nullValue: number;
  keepNegativePoisson: boolean;
  limits: PlausibilityLimits;
  modulusUnit: ModulusUnit;
  velocityUnit: VelocityUnit;
  impedanceUnit: ImpedanceUnit;
}

/** Elastic properties of each sample in the requested units; NaN where the sample is invalid. */
export interface ElasticLog {
  length: number;
  youngsModulus: Float64Array;
  poissonsRatio: Float64Array;
  shearModulus: Float64Array;
  bulkModulus: Float64Array;
  lameLambda: Float64Array;
  pWaveModulus: Float64Array;
  vpVsRatio: Float64Array;
  pImpedance: Float64Array;
  sImpedance: Float64Array;
  /** λρ in the modulus unit times g/cm3. */
  lambdaRho: Float64Array;
  /** μρ in the modulus unit times g/cm3. */
  muRho: Float64Array;
  /** Vp and Vs as used, in the velocity unit (NaN where absent or unusable). */
  vp: Float64Array;
  vs: Float64Array;
  /** One bit mask per sample (see qc-flags). */
  flags: Uint32Array;
  /** Bits that made a sample invalid under this request's options. */
  invalidMask: number;
}

const divideInPlace = (column: Float64Array, divisor: number): Float64Array => {
  if (divisor !== 1) for (let i = 0; i < column.length; i++) column[i] /= divisor;
  return column;
};

/** Screens the inputs, computes every property and expresses it in the requested units. */
export const computeElasticLog = (request: ElasticLogRequest): ElasticLog => {
  const length = request.compressional.values.length;
  const flags = new Uint32Array(length);
  const vp = sonicToMetresPerSecond(request.compressional, request.nullValue, flags);
  const vs = sonicToMetresPerSecond(request.shear, request.nullValue, flags);
  const rho = densityToSi(request.density, request.nullValue, flags);
  const invalidMask = invalidatingMask(request.keepNegativePoisson);
  const si = computeElasticSi(vp, vs, rho, flags, invalidMask, request.limits);
  const modulus = MODULUS_UNITS[request.modulusUnit];
  const modulusDensity = modulus * DENSITY_UNITS["g/cm3"];
  const impedance = IMPEDANCE_UNITS[request.impedanceUnit];
  const velocity = VELOCITY_UNITS[request.velocityUnit];
  return {
    length,
    youngsModulus: divideInPlace(si.youngsModulus, modulus),
    poissonsRatio: si.poissonsRatio,
    shearModulus: divideInPlace(si.shearModulus, modulus),
    bulkModulus: divideInPlace(si.bulkModulus, modulus),
    lameLambda: divideInPlace(si.lameLambda, modulus),
    pWaveModulus: divideInPlace(si.pWaveModulus, modulus),
    vpVsRatio: si.vpVsRatio,
    pImpedance: divideInPlace(si.pImpedance, impedance),
    sImpedance: divideInPlace(si.sImpedance, impedance),
    lambdaRho: divideInPlace(si.lambdaRho, modulusDensity),
    muRho: divideInPlace(si.muRho, modulusDensity),
    vp: divideInPlace(vp, velocity),
    vs: divideInPlace(vs, velocity),
    flags,
    invalidMask,
  };
};
