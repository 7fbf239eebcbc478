import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { velocitiesFromModuli } from "../../core/index.js";
import { elasticOf, relativeError } from "../helpers/elastic.js";

/** Valid rock-like samples: Vs in 300–4500 m/s, Vp/Vs strictly above √2 (ν > 0), ρ in 1.5–3.2 g/cm3. */
const validSample = fc
  .record({
    vs: fc.double({ min: 300, max: 4500, noNaN: true }),
    ratio: fc.double({ min: Math.SQRT2 * (1 + 1e-6), max: 4, noNaN: true }),
    rho: fc.double({ min: 1.5, max: 3.2, noNaN: true }),
  })
  .map(({ vs, ratio, rho }) => ({ vp: vs * ratio, vs, rho }));

const TOLERANCE = 1e-9;

describe("isotropic identities (Mavko, Mukerji & Dvorkin, The Rock Physics Handbook, 2nd ed., table 2.2.1)", () => {
  it("E = 2G(1+ν) = 3K(1−2ν) holds for random valid inputs", () => {
    fc.assert(
      fc.property(validSample, ({ vp, vs, rho }) => {
        const log = elasticOf([vp], [vs], [rho]);
        const [e, g, k, nu] = [log.youngsModulus[0], log.shearModulus[0], log.bulkModulus[0], log.poissonsRatio[0]];
        expect(relativeError(2 * g * (1 + nu), e)).toBeLessThan(TOLERANCE);
        // 3K(1−2ν) loses relative precision as ν → 0.5 (1−2ν cancels); compare on the scale of E + 3K.
        expect(Math.abs(3 * k * (1 - 2 * nu) - e) / (e + 3 * k)).toBeLessThan(TOLERANCE);
      }),
    );
  });

  it("K = λ + 2G/3 and M = K + 4G/3 = ρVp² hold for random valid inputs", () => {
    fc.assert(
      fc.property(validSample, ({ vp, vs, rho }) => {
        const log = elasticOf([vp], [vs], [rho]);
        const [g, k, lambda, m] = [log.shearModulus[0], log.bulkModulus[0], log.lameLambda[0], log.pWaveModulus[0]];
        expect(Math.abs(lambda + (2 * g) / 3 - k) / m).toBeLessThan(TOLERANCE);
        expect(relativeError(k + (4 * g) / 3, m)).toBeLessThan(TOLERANCE);
        expect(relativeError(m, (rho * 1000 * vp * vp) / 1e9)).toBeLessThan(TOLERANCE);
        expect(relativeError(g, (rho * 1000 * vs * vs) / 1e9)).toBeLessThan(TOLERANCE);
      }),
    );
  });

  it("(E, ν, ρ) → (Vp, Vs) → (E, ν) returns the starting values (round trip through the handbook's relations)", () => {
    const moduli = fc.record({
      eGpa: fc.double({ min: 1, max: 150, noNaN: true }),
      nu: fc.double({ min: 0.001, max: 0.45, noNaN: true }),
      rho: fc.double({ min: 1.5, max: 3.2, noNaN: true }),
    });
    fc.assert(
      fc.property(moduli, ({ eGpa, nu, rho }) => {
        const { vpMetresPerSecond, vsMetresPerSecond } = velocitiesFromModuli(eGpa * 1e9, nu, rho * 1000);
        const log = elasticOf([vpMetresPerSecond], [vsMetresPerSecond], [rho]);
        expect(relativeError(log.youngsModulus[0], eGpa)).toBeLessThan(TOLERANCE);
        expect(Math.abs(log.poissonsRatio[0] - nu)).toBeLessThan(TOLERANCE);
      }),
    );
  });

  it("P and S impedance are ρVp and ρVs, λρ = Ip² − 2Is² and μρ = Is² (Goodway et al., 1997, SEG Expanded Abstracts)", () => {
    fc.assert(
      fc.property(validSample, ({ vp, vs, rho }) => {
        const log = elasticOf([vp], [vs], [rho], { impedanceUnit: "kg/m2/s", modulusUnit: "Pa" });
        const ip = rho * 1000 * vp;
        const is = rho * 1000 * vs;
        expect(relativeError(log.pImpedance[0], ip)).toBeLessThan(TOLERANCE);
        expect(relativeError(log.sImpedance[0], is)).toBeLessThan(TOLERANCE);
        // λρ and μρ are reported in (modulus unit)·(g/cm3): here Pa·g/cm3, i.e. SI value / 1000.
        expect(Math.abs(log.lambdaRho[0] * 1000 - (ip * ip - 2 * is * is)) / (ip * ip)).toBeLessThan(TOLERANCE);
        expect(relativeError(log.muRho[0] * 1000, is * is)).toBeLessThan(TOLERANCE);
      }),
    );
  });
});

describe("facts of the trade (common practice)", () => {
  it("Vp/Vs = √2 gives ν = 0, and ν rises towards 0.5 as Vp/Vs grows", () => {
    const log = elasticOf([Math.SQRT2 * 2000, 1.6 * 2000, 2 * 2000, 3 * 2000], [2000, 2000, 2000, 2000], [2.5, 2.5, 2.5, 2.5]);
    expect(Math.abs(log.poissonsRatio[0])).toBeLessThan(1e-15);
    expect(log.poissonsRatio[1]).toBeCloseTo(0.1795, 4); // (2.56 − 2)/(2(2.56 − 1))
    expect(log.poissonsRatio[2]).toBeCloseTo(1 / 3, 12); // (4 − 2)/(2·3)
    expect(log.poissonsRatio[3]).toBeCloseTo(0.4375, 12); // (9 − 2)/(2·8)
    expect(log.flags[0]).toBe(0);
  });

  it("a typical shale sample (Vp 3000 m/s, Vs 1500 m/s, 2.45 g/cm3) has ν = 1/3 and E ≈ 14.7 GPa, inside the usual rock ranges", () => {
    const log = elasticOf([3000], [1500], [2.45]);
    // G = 2450·1500² = 5.5125 GPa; E = 2G(1 + 1/3) = 14.7 GPa. Rock E 10–100 GPa and ν 0.1–0.4 are common practice.
    expect(log.shearModulus[0]).toBeCloseTo(5.5125, 12);
    expect(log.youngsModulus[0]).toBeCloseTo(14.7, 12);
    expect(log.poissonsRatio[0]).toBeGreaterThan(0.1);
    expect(log.poissonsRatio[0]).toBeLessThan(0.4);
  });

  it("1 Mpsi = 6.894757 GPa: the same sample reported in Mpsi and GPa differ by that factor (1 psi = 6894.757293168362 Pa, the double nearest to its exact value)", () => {
    const gpa = elasticOf([4200], [2400], [2.6]);
    const mpsi = elasticOf([4200], [2400], [2.6], { modulusUnit: "Mpsi" });
    const psi = elasticOf([4200], [2400], [2.6], { modulusUnit: "psi" });
    expect(gpa.youngsModulus[0] / mpsi.youngsModulus[0]).toBeCloseTo(6.894757, 6);
    expect(relativeError(psi.youngsModulus[0] / 1e6, mpsi.youngsModulus[0])).toBeLessThan(1e-15);
  });
});
