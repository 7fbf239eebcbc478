import type { PlausibilityLimits } from "./plausibility-limits.js";
import { squareError, sumError } from "./exact-doubles.js";
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

const VS_NOT_BELOW_VP = flagBit("vs_not_below_vp");
const NEGATIVE_BULK = flagBit("negative_bulk_modulus");
const BELOW_SQRT2 = flagBit("vp_vs_below_sqrt2");
const VP_VS_HIGH = flagBit("vp_vs_high");
const RHO_RANGE = flagBit("density_out_of_range");
const VP_RANGE = flagBit("vp_out_of_range");
const VS_RANGE = flagBit("vs_out_of_range");
const NOT_FINITE = flagBit("not_finite");
const RHO_IMPOSSIBLE = flagBit("density_impossible");

/**
 * Bulk densities no rock can have, in kg/m3, whatever the plausibility limits a request sets: above osmium, the
 * densest element (22.59 g/cm3 at room conditions; from memory of the CRC Handbook of Chemistry and Physics), and
 * below a tenth of water, under the lightest rocks (pumice, about 0.25 g/cm3 and up; common practice). A density
 * log in kg/m3 read as g/cm3 (2400 for 2.4) lands above, one in g/cm3 read as kg/m3 below.
 */
export const IMPOSSIBLE_DENSITY_KG_M3 = { below: 100, above: 22_600 } as const;

/**
 * x0 + x1 + x2 + x3 (and x4 + x5 below) as if summed in twice a double's precision and then rounded (Ogita, Rump &
 * Oishi, 2005, "Accurate sum and dot product", SIAM J. Sci. Comput. 26, algorithm Sum2): the sum keeps its digits
 * however much the terms cancel. Two arities written out: the kernel's loop calls them per sample, without arrays.
 */
const compensatedSum4 = (x0: number, x1: number, x2: number, x3: number): number => {
  const s1 = x0 + x1;
  const s2 = s1 + x2;
  const s3 = s2 + x3;
  return s3 + (sumError(x0, x1, s1) + sumError(s1, x2, s2) + sumError(s2, x3, s3));
};

const compensatedSum = (x0: number, x1: number, x2: number, x3: number, x4: number, x5: number): number => {
  const s1 = x0 + x1;
  const s2 = s1 + x2;
  const s3 = s2 + x3;
  const s4 = s3 + x4;
  const s5 = s4 + x5;
  return s5 + (sumError(x0, x1, s1) + sumError(s1, x2, s2) + sumError(s2, x3, s3) + sumError(s3, x4, s4) + sumError(s4, x5, s5));
};

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
 *   G = ρVs², M = ρVp², λ = M − 2G = ρ(Vp² − 2Vs²), K = M − 4G/3 = ρ(3Vp² − 4Vs²)/3,
 *   ν = (Vp² − 2Vs²) / (2(Vp² − Vs²)),  E = G(3Vp² − 4Vs²) / (Vp² − Vs²) = 2G(1 + ν).
 * Every property is within a few units in the last place of its exact value for the given doubles, also where
 * Vp/Vs is near √2 or √(4/3) and the differences cancel (test/core/elastic-exactness.test.ts).
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
    // Above zero: a density at or below it is non_positive already.
    if (d > 0 && outside(d, IMPOSSIBLE_DENSITY_KG_M3.below, IMPOSSIBLE_DENSITY_KG_M3.above)) mask |= RHO_IMPOSSIBLE;
    if (outside(p, vpMinMetresPerSecond, vpMaxMetresPerSecond)) mask |= VP_RANGE;
    if (outside(s, vsMinMetresPerSecond, vsMaxMetresPerSecond)) mask |= VS_RANGE;
    // p² and s² exactly, each as a double and the rest it rounded off (Dekker's product, no FMA in JavaScript):
    // the differences below lose no digits where they cancel (Vp/Vs near √2 for ν and λ, near √(4/3) for K and E).
    const p2 = p * p;
    const s2 = s * s;
    const p2Rest = squareError(p, p2);
    const s2Rest = squareError(s, s2);
    // a = p² − 2s² (sign of ν and λ), b = p² − s², c = 3p² − 4s² (sign of K and E), each summed from exact terms:
    // 3p² = 2p² + p² and 3·p2Rest = 2·p2Rest + p2Rest are each a sum and its exact rounding error.
    const a = compensatedSum4(p2, -2 * s2, p2Rest, -2 * s2Rest);
    const b = compensatedSum4(p2, -s2, p2Rest, -s2Rest);
    const t0 = 2 * p2 + p2;
    const threeRest = 2 * p2Rest + p2Rest;
    const c = compensatedSum(t0, -4 * s2, sumError(2 * p2, p2, t0), threeRest, sumError(2 * p2Rest, p2Rest, threeRest), -4 * s2Rest);
    const ratio = p / s;
    // Ratio flags from the exact signs, so that a flag always agrees with the sign of ν and K it stands for. Where
    // the squares underflow or overflow (b is 0 or NaN), no sign is known: `not_finite` below says why.
    if (s >= p) mask |= VS_NOT_BELOW_VP;
    else if (b > 0 && c <= 0) mask |= NEGATIVE_BULK;
    else if (b > 0 && a < 0) mask |= BELOW_SQRT2;
    if (ratio > vpVsMax) mask |= VP_VS_HIGH;
    const g = d * s2 + d * s2Rest;
    const m = d * p2 + d * p2Rest;
    const lambda = d * a;
    const e = (g * c) / b;
    const nu = a / (2 * b);
    // Finite inputs beyond a double's range (Vp of 1e160 m/s overflows Vp²; Vp and Vs of 1e-200 m/s underflow
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
    bulkModulus[i] = (d * c) / 3 / modulus;
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
