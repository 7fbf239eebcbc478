import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  computeElasticColumns,
  DENSITY_UNITS,
  flagCodesOf,
  IMPEDANCE_UNITS,
  MODULUS_UNITS,
  withDefaultLimits,
  type ImpedanceUnit,
  type ModulusUnit,
} from "../../core/index.js";
import { exactly, minus, nearestDouble, over, plus, times, ulpsApart, type Rational } from "../helpers/exact-rational.js";

/**
 * Each property the kernel returns, against the exact value of its formula for the doubles the kernel is given
 * (Mavko, Mukerji & Dvorkin, The Rock Physics Handbook, 2nd ed., table 2.2.1), computed in exact rational
 * arithmetic and rounded once. "Correct to the last digit" here means within a few units in the last place (ulps):
 * Vp/Vs is a single division and correctly rounded; E is a product of three factors and a quotient (4 ulps); ν,
 * λρ and μρ are within 3, every other property within 2. The unit conversions before the kernel (slowness to velocity, g/cm3 to kg/m3) round
 * once each and are not part of this check.
 */
const MOST_ULPS: Record<string, number> = { vpVsRatio: 0, youngsModulus: 4, youngsModulusPascals: 4, poissonsRatio: 3, lambdaRho: 3, muRho: 3 };
const OTHERWISE_ULPS = 2;

const limits = withDefaultLimits();
const unitSizes = (modulus: ModulusUnit, impedance: ImpedanceUnit) => ({
  modulus: MODULUS_UNITS[modulus],
  impedance: IMPEDANCE_UNITS[impedance],
  modulusDensity: MODULUS_UNITS[modulus] * DENSITY_UNITS["g/cm3"],
});

const q = exactly;
const integer = (n: number): Rational => [BigInt(n), 1n];

/** The exact value of every output of one sample (SI inputs: m/s, m/s, kg/m3), in the chosen units. */
const exactOutputs = (vp: number, vs: number, rho: number, sizes: ReturnType<typeof unitSizes>) => {
  const [p, s, d] = [q(vp), q(vs), q(rho)];
  const p2 = times(p, p);
  const s2 = times(s, s);
  const g = times(d, s2);
  const m = times(d, p2);
  const lambda = minus(m, times(integer(2), g));
  const bulk = minus(m, over(times(integer(4), g), integer(3)));
  const nu = over(minus(p2, times(integer(2), s2)), times(integer(2), minus(p2, s2)));
  const e = over(times(g, minus(times(integer(3), p2), times(integer(4), s2))), minus(p2, s2));
  const [modulus, impedance, modulusDensity] = [q(sizes.modulus), q(sizes.impedance), q(sizes.modulusDensity)];
  return {
    youngsModulus: over(e, modulus),
    youngsModulusPascals: e,
    poissonsRatio: nu,
    shearModulus: over(g, modulus),
    bulkModulus: over(bulk, modulus),
    lameLambda: over(lambda, modulus),
    pWaveModulus: over(m, modulus),
    vpVsRatio: over(p, s),
    pImpedance: over(times(d, p), impedance),
    sImpedance: over(times(d, s), impedance),
    lambdaRho: over(times(lambda, d), modulusDensity),
    muRho: over(times(g, d), modulusDensity),
  };
};

/** Samples with Vp/Vs drawn around `ratio` within ± `spread` (relative), Vs 300–4500 m/s, ρ 1500–3200 kg/m3. */
const samplesAround = (ratio: number, spread: number) =>
  fc
    .record({
      vs: fc.double({ min: 300, max: 4500, noNaN: true }),
      offset: fc.double({ min: -spread, max: spread, noNaN: true }),
      rho: fc.double({ min: 1500, max: 3200, noNaN: true }),
    })
    .map(({ vs, offset, rho }) => ({ vp: vs * ratio * (1 + offset), vs, rho }))
    .filter(({ vp, vs }) => vp > vs);

const modulusUnit = fc.constantFrom<ModulusUnit>("GPa", "MPa", "Pa", "psi", "Mpsi");
const impedanceUnit = fc.constantFrom(...(Object.keys(IMPEDANCE_UNITS) as ImpedanceUnit[]));

const checkAgainstExact = (sample: { vp: number; vs: number; rho: number }, modulus: ModulusUnit, impedance: ImpedanceUnit) => {
  const sizes = unitSizes(modulus, impedance);
  // No sample is made invalid here (mask 0): the values of flagged samples are checked too.
  const columns = computeElasticColumns(
    Float64Array.of(sample.vp),
    Float64Array.of(sample.vs),
    Float64Array.of(sample.rho),
    new Uint32Array(1),
    0,
    limits,
    sizes,
  );
  for (const [name, value] of Object.entries(exactOutputs(sample.vp, sample.vs, sample.rho, sizes))) {
    const computed = columns[name as keyof typeof columns][0];
    const exact = nearestDouble(value);
    expect(ulpsApart(computed, exact), `${name} = ${computed}, exact ${exact} (${JSON.stringify(sample)}, ${modulus})`).toBeLessThanOrEqual(
      MOST_ULPS[name] ?? OTHERWISE_ULPS,
    );
  }
};

/** Doubles of either sign between 1e-100 and 1e100, where products and quotients of two stay normal. */
const normal = fc
  .tuple(fc.boolean(), fc.double({ min: 1e-100, max: 1e100, noNaN: true }))
  .map(([negative, magnitude]) => (negative ? -magnitude : magnitude));

describe("the exact-arithmetic reference itself (IEEE 754-2019 §4.3: +, −, ×, ÷ are correctly rounded)", () => {
  it("gives back every double, and the hardware's result for one operation on two doubles", () => {
    fc.assert(
      fc.property(normal, normal, (x, y) => {
        expect(nearestDouble(q(x))).toBe(x);
        expect(nearestDouble(over(q(x), q(y)))).toBe(x / y);
        expect(nearestDouble(times(q(x), q(y)))).toBe(x * y);
        if (x !== -y) expect(nearestDouble(plus(q(x), q(y)))).toBe(x + y);
        if (x !== y) expect(nearestDouble(minus(q(x), q(y)))).toBe(x - y);
      }),
    );
  });

  it("rounds ties to even, and counts units in the last place", () => {
    expect(nearestDouble([2n ** 53n + 1n, 1n])).toBe(2 ** 53);
    expect(nearestDouble([2n ** 53n + 3n, 1n])).toBe(2 ** 53 + 4);
    expect(ulpsApart(1, 1 + Number.EPSILON)).toBe(1);
    expect(ulpsApart(0.1 + 0.2, 0.3)).toBe(1);
  });
});

describe("every property within a few units in the last place of its exact value", () => {
  it("for rock-like samples (Vp/Vs 1.5–2.5), in every modulus and impedance unit", () => {
    fc.assert(fc.property(samplesAround(2, 0.25), modulusUnit, impedanceUnit, checkAgainstExact), { numRuns: 300 });
  });

  it("where Vp/Vs is near √2, where ν and λ are differences of nearly equal terms (a dry or gas-bearing sand's ν near 0)", () => {
    fc.assert(fc.property(samplesAround(Math.SQRT2, 1e-9), modulusUnit, impedanceUnit, checkAgainstExact), { numRuns: 300 });
  });

  it("where Vp/Vs is near √(4/3), where K and E are", () => {
    fc.assert(fc.property(samplesAround(Math.sqrt(4 / 3), 1e-9), modulusUnit, impedanceUnit, checkAgainstExact), { numRuns: 300 });
  });

  it("for soft, high-ratio samples (Vp/Vs 2.5–4)", () => {
    fc.assert(fc.property(samplesAround(3.25, 0.23), modulusUnit, impedanceUnit, checkAgainstExact), { numRuns: 200 });
  });
});

/** The flags one sample gets from the kernel alone. */
const kernelFlags = (vp: number, vs: number, rho = 2400) => {
  const flags = new Uint32Array(1);
  computeElasticColumns(Float64Array.of(vp), Float64Array.of(vs), Float64Array.of(rho), flags, 0, limits);
  return flagCodesOf(flags[0]).filter((code) => code !== "vp_out_of_range" && code !== "vs_out_of_range");
};

describe("ratio flags follow the exact signs of ν and K", () => {
  it("vp_vs_below_sqrt2 exactly when Vp² < 2Vs², negative_bulk_modulus exactly when 3Vp² ≤ 4Vs², near both thresholds", () => {
    const nearThreshold = fc.oneof(samplesAround(Math.SQRT2, 1e-15), samplesAround(Math.sqrt(4 / 3), 1e-15));
    fc.assert(
      fc.property(nearThreshold, ({ vp, vs, rho }) => {
        const [p2, s2] = [times(q(vp), q(vp)), times(q(vs), q(vs))];
        const sign = ([numerator]: Rational) => (numerator > 0n ? 1 : numerator < 0n ? -1 : 0);
        const nuSign = sign(minus(p2, times(integer(2), s2)));
        const bulkSign = sign(minus(times(integer(3), p2), times(integer(4), s2)));
        const codes = kernelFlags(vp, vs, rho);
        expect(codes.includes("negative_bulk_modulus")).toBe(bulkSign <= 0);
        expect(codes.includes("vp_vs_below_sqrt2")).toBe(bulkSign > 0 && nuSign < 0);
      }),
      { numRuns: 500 },
    );
  });

  // Whole numbers whose squares differ by one from the threshold (solutions of Pell's equations x² − 2y² = ±1 and
  // X² − 3Y² = 1 or −3 with X = 2·Vs): Vp/Vs lies within 1e-8 of √2 or √(4/3), on a known side, and ν or K is known exactly.
  it("Vp 3363, Vs 2378 m/s: 3363² − 2·2378² = 1, so ν = 1/11309770 > 0 and no flag", () => {
    expect(kernelFlags(3363, 2378)).toEqual([]);
    const columns = computeElasticColumns(Float64Array.of(3363), Float64Array.of(2378), Float64Array.of(2400), new Uint32Array(1), 0, limits);
    expect(columns.poissonsRatio[0]).toBe(1 / 11309770);
    expect(columns.lameLambda[0]).toBe(2400);
  });

  it("Vp 8119, Vs 5741 m/s: 8119² − 2·5741² = −1, so ν = −1/65918160 and vp_vs_below_sqrt2", () => {
    expect(kernelFlags(8119, 5741)).toEqual(["vp_vs_below_sqrt2"]);
    const columns = computeElasticColumns(Float64Array.of(8119), Float64Array.of(5741), Float64Array.of(2400), new Uint32Array(1), 0, limits);
    expect(columns.poissonsRatio[0]).toBe(-1 / 65918160);
  });

  it("Vp 2911, Vs 2521 m/s: 3·2911² − 4·2521² = −1, so K < 0 and negative_bulk_modulus", () => {
    expect(kernelFlags(2911, 2521)).toEqual(["negative_bulk_modulus"]);
  });

  it("Vp 1351, Vs 1170 m/s: 3·1351² − 4·1170² = 3, so K = ρ·3/3 = 2400 Pa > 0: vp_vs_below_sqrt2, not negative_bulk_modulus", () => {
    expect(kernelFlags(1351, 1170)).toEqual(["vp_vs_below_sqrt2"]);
    const columns = computeElasticColumns(Float64Array.of(1351), Float64Array.of(1170), Float64Array.of(2400), new Uint32Array(1), 0, limits);
    expect(columns.bulkModulus[0]).toBe(2400);
  });
});
