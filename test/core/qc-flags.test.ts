import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { FLAG_CODES, flagBit, flagCodesOf, invalidatingMask, severityOf, summariseFlags } from "../../core/index.js";
import { elasticOf } from "../helpers/elastic.js";

const codes = (vp: number, vs: number, rho: number, options: Parameters<typeof elasticOf>[3] = {}) =>
  flagCodesOf(elasticOf([vp], [vs], [rho], options).flags[0]);

const next = (x: number) => x + Math.abs(x) * Number.EPSILON * 2;
const previous = (x: number) => x - Math.abs(x) * Number.EPSILON * 2;

describe("QC flag thresholds, at and just either side", () => {
  it("missing: null (NaN) and the null value are missing; values next to the null value are not", () => {
    expect(codes(NaN, 1500, 2.4)).toContain("missing");
    expect(codes(3000, -999.25, 2.4)).toContain("missing");
    expect(codes(3000, 1500, -999.25)).toContain("missing");
    expect(codes(3000, 1500, -999.25, { nullValue: -9999 })).toEqual(["non_positive"]);
    expect(codes(3000, next(-999.25), 2.4)).toEqual(["non_positive"]);
    expect(codes(3000, 1500, 2.4, { nullValue: 2.4 })).toEqual(["missing"]);
  });

  it("not_finite: ±Infinity (e.g. 1e309 in JSON) is invalid", () => {
    expect(codes(Infinity, 1500, 2.4)).toEqual(["not_finite"]);
    expect(codes(3000, 1500, -Infinity)).toEqual(["not_finite"]);
  });

  it("not_finite: finite inputs whose velocity or properties overflow a double are invalid, with null properties", () => {
    // Vp = 1e160 m/s is finite; Vp² is not (Number.MAX_VALUE ≈ 1.8e308, IEEE 754 binary64).
    const fastest = elasticOf([1e160], [5e159], [2.4]);
    expect(flagCodesOf(fastest.flags[0])).toEqual(["not_finite", "vp_out_of_range", "vs_out_of_range"]);
    expect(fastest.flags[0] & fastest.invalidMask).not.toBe(0);
    expect([fastest.youngsModulus[0], fastest.shearModulus[0], fastest.muRho[0], fastest.pImpedance[0]].every(Number.isNaN)).toBe(true);
    // A slowness of 1e-320 µs/ft (subnormal) is a velocity of 3e325 m/s, beyond a double: not "Vs not below Vp".
    const fast = elasticOf([3000], [1e-320], [2.4], { shear: { measure: "slowness", unit: "us/ft", values: Float64Array.of(1e-320) } });
    expect(flagCodesOf(fast.flags[0])).toEqual(["not_finite"]);
    // A velocity absurd but within range of every product and of E's intermediate ρVs²·(3Vp² − 4Vs²) is only out of range.
    expect(codes(1e70, 5e69, 2.4)).toEqual(["vp_out_of_range", "vs_out_of_range"]);
  });

  it("not_finite is never added to a sample already invalid for another reason (Vs = Vp divides E by zero; a density no rock has)", () => {
    expect(codes(1e160, 1e160, 2.4)).toEqual(["vs_not_below_vp", "vp_out_of_range", "vs_out_of_range"]);
    // ρ = 1e300 g/cm3 overflows ρVs², but is density_impossible first.
    expect(codes(3000, 1500, 1e300)).toEqual(["density_out_of_range", "density_impossible"]);
  });

  it("density_impossible: above 22.6 g/cm3 (osmium, the densest element, 22.59 g/cm3; from memory of the CRC Handbook) or below 0.1 g/cm3 (under pumice, the lightest rock; common practice), whatever the plausibility limits", () => {
    expect(codes(3000, 1500, 22.6)).toEqual(["density_out_of_range"]);
    expect(codes(3000, 1500, next(22.6))).toEqual(["density_out_of_range", "density_impossible"]);
    expect(codes(3000, 1500, 0.1)).toEqual(["density_out_of_range"]);
    expect(codes(3000, 1500, previous(0.1))).toEqual(["density_out_of_range", "density_impossible"]);
    // The usual mistake: a log in kg/m3 read as g/cm3, and the reverse. Its moduli are null, so no zone statistic takes them.
    const misread = elasticOf([3000], [1500], [2400]);
    expect(flagCodesOf(misread.flags[0])).toEqual(["density_out_of_range", "density_impossible"]);
    expect(Number.isNaN(misread.youngsModulus[0])).toBe(true);
    expect(codes(3000, 1500, 0.0024)).toEqual(["density_out_of_range", "density_impossible"]);
    // Wider plausibility limits do not make it possible; a density at or below zero is non_positive alone.
    expect(codes(3000, 1500, 30, { limits: { rhoMaxGramsPerCubicCentimetre: 40 } })).toEqual(["density_impossible"]);
    expect(codes(3000, 1500, -2.4)).toEqual(["non_positive"]);
  });

  it("property: every sample that is not invalid has every property finite, whatever its positive finite inputs", () => {
    const positive = fc.double({ min: Number.MIN_VALUE, max: Number.MAX_VALUE, noNaN: true });
    fc.assert(
      fc.property(positive, positive, positive, fc.boolean(), (vp, vs, rho, keepNegativePoisson) => {
        const log = elasticOf([vp], [vs], [rho], { keepNegativePoisson });
        if ((log.flags[0] & log.invalidMask) !== 0) return;
        const properties = [log.youngsModulus, log.poissonsRatio, log.shearModulus, log.bulkModulus, log.lameLambda, log.pWaveModulus, log.vpVsRatio, log.pImpedance, log.sImpedance, log.lambdaRho, log.muRho, log.vp, log.vs];
        expect(properties.every((column) => Number.isFinite(column[0]))).toBe(true);
      }),
      { numRuns: 3000 },
    );
  });

  it("non_positive: 0 and negative inputs are invalid, the smallest positive number is not non_positive", () => {
    expect(codes(0, 1500, 2.4)).toContain("non_positive");
    expect(codes(3000, -1, 2.4)).toContain("non_positive");
    expect(codes(3000, 1500, 0)).toContain("non_positive");
    expect(codes(3000, 1500, Number.MIN_VALUE)).not.toContain("non_positive");
  });

  it("vs_not_below_vp: Vs = Vp and Vs > Vp are invalid; Vs just below Vp is not this flag", () => {
    expect(codes(2000, 2000, 2.4)).toEqual(["vs_not_below_vp"]);
    expect(codes(2000, 2500, 2.4)).toEqual(["vs_not_below_vp"]);
    expect(codes(2000, previous(2000), 2.4)).toEqual(["negative_bulk_modulus"]);
  });

  it("negative_bulk_modulus: Vp/Vs ≤ √(4/3) is invalid; just above it the sample is vp_vs_below_sqrt2 instead", () => {
    const threshold = Math.sqrt(4 / 3);
    expect(codes(threshold * 2000, 2000, 2.4)).toEqual(["negative_bulk_modulus"]);
    expect(codes(next(threshold) * 2000, 2000, 2.4)).toEqual(["vp_vs_below_sqrt2"]);
    const log = elasticOf([threshold * 2000], [2000], [2.4], { keepNegativePoisson: true });
    expect(Number.isNaN(log.bulkModulus[0])).toBe(true);
  });

  it("vp_vs_below_sqrt2: Vp/Vs just below √2 is invalid by default; at √2 it is not flagged", () => {
    expect(codes(previous(Math.SQRT2) * 2000, 2000, 2.4)).toEqual(["vp_vs_below_sqrt2"]);
    expect(codes(Math.SQRT2 * 2000, 2000, 2.4)).toEqual([]);
    const log = elasticOf([previous(Math.SQRT2) * 2000, 1.3 * 2000], [2000, 2000], [2.4, 2.4]);
    expect(Number.isNaN(log.youngsModulus[0])).toBe(true);
    expect(Number.isNaN(log.poissonsRatio[1])).toBe(true);
  });

  it("vp_vs_below_sqrt2 with keep_negative_poisson: values returned with ν < 0, flag severity suspect", () => {
    const log = elasticOf([1.3 * 2000], [2000], [2.4], { keepNegativePoisson: true });
    expect(flagCodesOf(log.flags[0])).toEqual(["vp_vs_below_sqrt2"]);
    expect(severityOf("vp_vs_below_sqrt2", log.invalidMask)).toBe("suspect");
    expect(log.poissonsRatio[0]).toBeCloseTo((1.69 - 2) / (2 * (1.69 - 1)), 12);
    expect(log.poissonsRatio[0]).toBeLessThan(0);
  });

  it("vp_out_of_range / vs_out_of_range / density_out_of_range: bounds are inclusive, a hair beyond is suspect", () => {
    expect(codes(1300, 500, 2.0)).toEqual([]);
    expect(codes(previous(1300), 500, 2.0)).toEqual(["vp_out_of_range"]);
    expect(codes(7500, 4000, 2.8)).toEqual([]);
    expect(codes(next(7500), 4000, 2.8)).toEqual(["vp_out_of_range"]);
    const loose = { limits: { vpVsMax: 10 } };
    expect(codes(1500, 250, 2.0, loose)).toEqual([]);
    expect(codes(1500, previous(250), 2.0, loose)).toEqual(["vs_out_of_range"]);
    expect(codes(7400, 4500, 2.8)).toEqual([]);
    expect(codes(7400, next(4500), 2.8)).toEqual(["vs_out_of_range"]);
    expect(codes(3000, 1500, 1.0)).toEqual([]);
    expect(codes(3000, 1500, previous(1.0))).toEqual(["density_out_of_range"]);
    expect(codes(3000, 1500, 3.1)).toEqual([]);
    expect(codes(3000, 1500, next(3.1))).toEqual(["density_out_of_range"]);
  });

  it("vp_vs_high: Vp/Vs = 3.0 is not flagged, just above is suspect and values are kept", () => {
    expect(codes(3000, 1000, 2.2)).toEqual([]);
    const log = elasticOf([next(3) * 1000], [1000], [2.2]);
    expect(flagCodesOf(log.flags[0])).toEqual(["vp_vs_high"]);
    expect(Number.isFinite(log.youngsModulus[0])).toBe(true);
  });

  it("plausibility limits can be overridden per request", () => {
    expect(codes(3000, 1000, 2.2, { limits: { vpVsMax: 2.5 } })).toEqual(["vp_vs_high"]);
    expect(codes(3000, 1500, 2.4, { limits: { rhoMaxGramsPerCubicCentimetre: 2.3 } })).toEqual(["density_out_of_range"]);
    expect(codes(3000, 1500, 2.4, { limits: { vpMinMetresPerSecond: 3500 } })).toEqual(["vp_out_of_range"]);
  });
});

describe("flag catalogue", () => {
  it("every code has its own bit and a severity; the invalidating mask follows keep_negative_poisson", () => {
    expect(new Set(FLAG_CODES.map(flagBit)).size).toBe(FLAG_CODES.length);
    expect(severityOf("vp_vs_below_sqrt2", invalidatingMask(false))).toBe("invalid");
    expect(severityOf("vp_vs_below_sqrt2", invalidatingMask(true))).toBe("suspect");
    expect(severityOf("missing", invalidatingMask(true))).toBe("invalid");
    expect(severityOf("vp_vs_high", invalidatingMask(false))).toBe("suspect");
  });

  it("summariseFlags counts samples, valid samples and samples per code", () => {
    const log = elasticOf([3000, NaN, 2000, 3000], [1500, 1500, 2500, 900], [2.4, 2.4, 2.4, 2.4]);
    expect(summariseFlags(log.flags, log.invalidMask)).toEqual({
      count: 4,
      valid: 2,
      flags: { missing: 1, vs_not_below_vp: 1, vp_vs_high: 1 },
    });
  });
});
