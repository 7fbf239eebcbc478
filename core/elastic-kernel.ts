import type { PlausibilityLimits } from "./plausibility-limits.js";
import { flagBit } from "./qc-flags.js";

/**
 * Columns of the isotropic elastic properties of each sample, each in its unit (see `UnitSizes`). NaN where invalid.
 * `youngsModulusPascals` is E in Pa whatever the modulus unit: the empirical correlations take it in SI.
 */
export interface ElasticColumns {
  youngsModulusPascals: Float64Array;
  youngsModulus: Float64Array;
  poissonsRatio: Float64Array;
  shearModulus: Float64Array;
  bulkModulus: Float64Array;
  lameLambda: Float64Array;
  pWaveModulus: Float64Array;
  vpVsRatio: Float64Array;
  pImpedance: Float64Array;
  sImpedance: Float64Array;
  /** λρ in Pa·kg/m3. */
  lambdaRho: Float64Array;
  /** μρ in Pa·kg/m3. */
  muRho: Float64Array;
}

const SQRT_FOUR_THIRDS = Math.sqrt(4 / 3);
const VS_NOT_BELOW_VP = flagBit("vs_not_below_vp");
const NEGATIVE_BULK = flagBit("negative_bulk_modulus");
const BELOW_SQRT2 = flagBit("vp_vs_below_sqrt2");
const VP_VS_HIGH = flagBit("vp_vs_high");
const RHO_RANGE = flagBit("density_out_of_range");
const VP_RANGE = flagBit("vp_out_of_range");
const VS_RANGE = flagBit("vs_out_of_range");
const NOT_FINITE = flagBit("not_finite");

const outside = (value: number, min: number, max: number): boolean => value < min || value > max;

/** Size of each output unit in SI: 1e9 for GPa, so that a value in Pa divided by it is in GPa. */
export interface UnitSizes {
  /** Moduli (E, G, K, λ, M), in Pa. */
  modulus: number;
  /** Impedances, in m/s·kg/m3. */
  impedance: number;
  /** λρ and μρ, in Pa·kg/m3. */
  modulusDensity: number;
}

const SI: UnitSizes = { modulus: 1, impedance: 1, modulusDensity: 1 };

/**
 * Isotropic elastic properties from Vp, Vs (m/s) and ρ (kg/m3), sample by sample
 * (Mavko, Mukerji & Dvorkin, The Rock Physics Handbook, 2nd ed., §2.2 / table 2.2.1):
 *   G = ρVs², M = ρVp², λ = M − 2G, K = M − 4G/3,
 *   ν = (Vp² − 2Vs²) / (2(Vp² − Vs²)),  E = G(3Vp² − 4Vs²) / (Vp² − Vs²) = 2G(1 + ν).
 * Each value is computed in SI and divided by its unit's size as it is stored: the same quotient as dividing a
 * stored SI column afterwards, without a second pass over a whole well's columns (sizes of 1 give SI).
 * Adds the ratio and range flags to `flags`, and `not_finite` where finite inputs overflow a property; a sample whose mask meets `invalidMask` gets NaN.
 * NaN inputs (already flagged by screening) give NaN outputs.
 */
export const computeElasticColumns = (
  vp: Float64Array,
  vs: Float64Array,
  rho: Float64Array,
  flags: Uint32Array,
  invalidMask: number,
  limits: PlausibilityLimits,
  sizes: UnitSizes = SI,
): ElasticColumns => {
  const n = vp.length;
  const { modulus, impedance, modulusDensity } = sizes;
  const youngsModulus = new Float64Array(n);
  // E in Pa is a column of its own only when the modulus unit is not Pa.
  const youngsModulusPascals = modulus === 1 ? youngsModulus : new Float64Array(n);
  const poissonsRatio = new Float64Array(n);
  const shearModulus = new Float64Array(n);
  const bulkModulus = new Float64Array(n);
  const lameLambda = new Float64Array(n);
  const pWaveModulus = new Float64Array(n);
  const vpVsRatio = new Float64Array(n);
  const pImpedance = new Float64Array(n);
  const sImpedance = new Float64Array(n);
  const lambdaRho = new Float64Array(n);
  const muRho = new Float64Array(n);
  const rhoMin = limits.rhoMinGramsPerCubicCentimetre * 1000;
  const rhoMax = limits.rhoMaxGramsPerCubicCentimetre * 1000;
  const { vpMinMetresPerSecond, vpMaxMetresPerSecond, vsMinMetresPerSecond, vsMaxMetresPerSecond, vpVsMax } = limits;
  for (let i = 0; i < n; i++) {
    const p = vp[i];
    const s = vs[i];
    const d = rho[i];
    let mask = flags[i];
    if (outside(d, rhoMin, rhoMax)) mask |= RHO_RANGE;
    if (outside(p, vpMinMetresPerSecond, vpMaxMetresPerSecond)) mask |= VP_RANGE;
    if (outside(s, vsMinMetresPerSecond, vsMaxMetresPerSecond)) mask |= VS_RANGE;
    const ratio = p / s;
    if (s >= p) mask |= VS_NOT_BELOW_VP;
    else if (ratio <= SQRT_FOUR_THIRDS) mask |= NEGATIVE_BULK;
    else if (ratio < Math.SQRT2) mask |= BELOW_SQRT2;
    if (ratio > vpVsMax) mask |= VP_VS_HIGH;
    const p2 = p * p;
    const s2 = s * s;
    const g = d * s2;
    const m = d * p2;
    const lambda = m - 2 * g;
    const e = (g * (3 * p2 - 4 * s2)) / (p2 - s2);
    const nu = (p2 - 2 * s2) / (2 * (p2 - s2));
    // Finite inputs beyond a double's range (rho 1e300 g/cm3 overflows ρVs²; Vp and Vs of 1e-200 m/s underflow
    // to 0/0) would give infinite or NaN properties. With Vs < Vp, |λ|, |K| and G are below M, |λρ| and μρ below
    // Mρ, and ρVs below ρVp: E, ν, Vp/Vs, Mρ and ρVp finite means every property is (NaN fails each `<`).
    if ((mask & invalidMask) === 0 && !Number.isNaN(ratio + d) && !(Math.abs(e) < Infinity && Math.abs(nu) < Infinity && ratio < Infinity && m * d < Infinity && d * p < Infinity)) {
      mask |= NOT_FINITE;
    }
    flags[i] = mask;
    if ((mask & invalidMask) !== 0 || Number.isNaN(ratio + d)) {
      youngsModulusPascals[i] = NaN;
      youngsModulus[i] = NaN;
      poissonsRatio[i] = NaN;
      shearModulus[i] = NaN;
      bulkModulus[i] = NaN;
      lameLambda[i] = NaN;
      pWaveModulus[i] = NaN;
      vpVsRatio[i] = NaN;
      pImpedance[i] = NaN;
      sImpedance[i] = NaN;
      lambdaRho[i] = NaN;
      muRho[i] = NaN;
      continue;
    }
    shearModulus[i] = g / modulus;
    pWaveModulus[i] = m / modulus;
    lameLambda[i] = lambda / modulus;
    bulkModulus[i] = (m - (4 / 3) * g) / modulus;
    poissonsRatio[i] = nu;
    youngsModulusPascals[i] = e;
    youngsModulus[i] = e / modulus;
    vpVsRatio[i] = ratio;
    pImpedance[i] = (d * p) / impedance;
    sImpedance[i] = (d * s) / impedance;
    lambdaRho[i] = (lambda * d) / modulusDensity;
    muRho[i] = (g * d) / modulusDensity;
  }
  return {
    youngsModulusPascals,
    youngsModulus,
    poissonsRatio,
    shearModulus,
    bulkModulus,
    lameLambda,
    pWaveModulus,
    vpVsRatio,
    pImpedance,
    sImpedance,
    lambdaRho,
    muRho,
  };
};
