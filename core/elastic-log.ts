import type { Correlation } from "./correlations/correlation.js";
import { fillGaps, type FillMode } from "./correlations/fill-gaps.js";
import { computeElasticColumns } from "./elastic-kernel.js";
import { densityToSi, sonicToMetresPerSecond, type DensityCurve, type SonicCurve } from "./input-screening.js";
import type { PlausibilityLimits } from "./plausibility-limits.js";
import { flagBit, invalidatingMask } from "./qc-flags.js";
import {
  DENSITY_UNITS,
  IMPEDANCE_UNITS,
  MODULUS_UNITS,
  VELOCITY_UNITS,
  type ImpedanceUnit,
  type ModulusUnit,
  type VelocityUnit,
} from "./units.js";

/** Predict a missing input from Vp with an empirical correlation (`vs` kind in m/s, `density` kind in g/cm3). */
export interface GapFill {
  correlation: Correlation;
  mode: FillMode;
}

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
  /** Gap filling, only when asked for: every filled sample is flagged estimated_vs or estimated_rho. */
  fillShear?: GapFill;
  fillDensity?: GapFill;
}

/** Columns in SI units (m/s, kg/m3, Pa), as inputs to empirical correlations; NaN where absent or invalid. */
export interface ElasticColumnsForCorrelations {
  vpMetresPerSecond: Float64Array;
  densityKilogramsPerCubicMetre: Float64Array;
  dynamicYoungsModulusPascals: Float64Array;
  poissonsRatio: Float64Array;
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
  /** Vp and Vs as used (measured or filled), in the velocity unit (NaN where absent or unusable). */
  vp: Float64Array;
  vs: Float64Array;
  /** Bulk density as used (measured or filled), in the density input's unit (NaN where absent or unusable). */
  rho: Float64Array;
  /** One bit mask per sample (see qc-flags). */
  flags: Uint32Array;
  /** Bits that made a sample invalid under this request's options. */
  invalidMask: number;
  /** Samples whose Vs or density was predicted by a gap-filling correlation. */
  filled: { vs: number; rho: number };
  si: ElasticColumnsForCorrelations;
}

const ESTIMATED_VS = flagBit("estimated_vs");
const ESTIMATED_RHO = flagBit("estimated_rho");
const NON_POSITIVE = flagBit("non_positive");
const OUTSIDE_CALIBRATION = flagBit("outside_calibration");

/** A copy divided by `divisor`, or the column itself when there is nothing to divide. */
const divided = (column: Float64Array, divisor: number): Float64Array => {
  if (divisor === 1) return column;
  const out = new Float64Array(column.length);
  for (let i = 0; i < column.length; i++) out[i] = column[i] / divisor;
  return out;
};

/**
 * Replaces unusable samples of an input (SI column `si`, screening bits `own`) by a correlation's prediction
 * from Vp: a filled sample loses the input's screening bits and gains `estimatedBit`, and `outside_calibration`
 * where the prediction extrapolates. `toSi` converts the correlation's output unit to SI.
 */
const fillInput = (
  fill: GapFill,
  si: Float64Array,
  own: Uint32Array,
  vp: Float64Array,
  estimatedBit: number,
  toSi: number,
): { si: Float64Array; count: number } => {
  const prediction = fill.correlation.evaluate({ vpMetresPerSecond: vp });
  const predicted = toSi === 1 ? prediction.values : prediction.values.map((value) => value * toSi);
  const result = fillGaps(si, predicted, fill.mode);
  for (let i = 0; i < si.length; i++) {
    if (result.filled[i] === 0) continue;
    own[i] = estimatedBit | (prediction.outsideCalibration[i] === 1 ? OUTSIDE_CALIBRATION : 0);
    // A linear fit taken below its range predicts zero or less (Castagna's mudrock line below Vp ≈ 1360 m/s):
    // no rock has that, so the filled sample is invalid, and the prediction is not passed on as a velocity.
    if (!(result.values[i] > 0)) {
      own[i] |= NON_POSITIVE;
      result.values[i] = NaN;
    }
  }
  return { si: result.values, count: result.count };
};

/** Screens the inputs, fills gaps when asked, computes every property and expresses it in the requested units. */
export const computeElasticLog = (request: ElasticLogRequest): ElasticLog => {
  const length = request.compressional.values.length;
  const flags = new Uint32Array(length);
  const vp = sonicToMetresPerSecond(request.compressional, request.nullValue, flags);
  let vs: Float64Array;
  let rho: Float64Array;
  const filled = { vs: 0, rho: 0 };
  if (request.fillShear === undefined) vs = sonicToMetresPerSecond(request.shear, request.nullValue, flags);
  else {
    const own = new Uint32Array(length);
    const result = fillInput(request.fillShear, sonicToMetresPerSecond(request.shear, request.nullValue, own), own, vp, ESTIMATED_VS, 1);
    for (let i = 0; i < length; i++) flags[i] |= own[i];
    vs = result.si;
    filled.vs = result.count;
  }
  if (request.fillDensity === undefined) rho = densityToSi(request.density, request.nullValue, flags);
  else {
    const own = new Uint32Array(length);
    const result = fillInput(request.fillDensity, densityToSi(request.density, request.nullValue, own), own, vp, ESTIMATED_RHO, DENSITY_UNITS["g/cm3"]);
    for (let i = 0; i < length; i++) flags[i] |= own[i];
    rho = result.si;
    filled.rho = result.count;
  }
  const invalidMask = invalidatingMask(request.keepNegativePoisson);
  const modulus = MODULUS_UNITS[request.modulusUnit];
  const columns = computeElasticColumns(vp, vs, rho, flags, invalidMask, request.limits, {
    modulus,
    impedance: IMPEDANCE_UNITS[request.impedanceUnit],
    modulusDensity: modulus * DENSITY_UNITS["g/cm3"],
  });
  const velocity = VELOCITY_UNITS[request.velocityUnit];
  return {
    length,
    youngsModulus: columns.youngsModulus,
    poissonsRatio: columns.poissonsRatio,
    shearModulus: columns.shearModulus,
    bulkModulus: columns.bulkModulus,
    lameLambda: columns.lameLambda,
    pWaveModulus: columns.pWaveModulus,
    vpVsRatio: columns.vpVsRatio,
    pImpedance: columns.pImpedance,
    sImpedance: columns.sImpedance,
    lambdaRho: columns.lambdaRho,
    muRho: columns.muRho,
    vp: divided(vp, velocity),
    vs: divided(vs, velocity),
    rho: divided(rho, DENSITY_UNITS[request.density.unit]),
    flags,
    invalidMask,
    filled,
    si: {
      vpMetresPerSecond: vp,
      densityKilogramsPerCubicMetre: rho,
      dynamicYoungsModulusPascals: columns.youngsModulusPascals,
      poissonsRatio: columns.poissonsRatio,
    },
  };
};
