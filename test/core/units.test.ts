import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  metresPerSecondToSlowness,
  metresPerSecondToVelocity,
  modulusToPascals,
  pascalsToModulus,
  slownessToMetresPerSecond,
  velocityToMetresPerSecond,
  MODULUS_UNITS,
  SLOWNESS_UNITS,
  VELOCITY_UNITS,
} from "../../core/index.js";
import { relativeError } from "../helpers/elastic.js";
import { nearestDouble } from "../helpers/exact-rational.js";

describe("unit conversions (exact factors: 1 ft = 0.3048 m; 1 psi = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)², NIST SP 811 appendix B)", () => {
  it("100 µs/ft is 3048 m/s and 10,000 ft/s; 200 µs/m is 5000 m/s", () => {
    expect(slownessToMetresPerSecond(100, "us/ft")).toBe(3048);
    expect(metresPerSecondToVelocity(3048, "ft/s")).toBeCloseTo(10000, 9);
    expect(slownessToMetresPerSecond(200, "us/m")).toBe(5000);
    // Water near 189 µs/ft ≈ 1613 m/s is a textbook check value (common practice).
    expect(slownessToMetresPerSecond(189, "us/ft")).toBeCloseTo(1612.698, 3);
  });

  it("1 psi is the double nearest to 0.45359237 × 9.80665 / 0.0254² Pa = 6894.757293168361336… Pa, and 1 Mpsi = 6.894757293168 GPa", () => {
    // The exact quotient of the defining constants, rounded once (the plain floating-point expression rounds three times).
    const exact = nearestDouble([45359237n * 980665n, 64516n * 100000n]);
    expect(modulusToPascals(1, "psi")).toBe(exact);
    expect(exact).toBe(6894.757293168362);
    expect(modulusToPascals(1, "Mpsi") / 1e9).toBeCloseTo(6.894757293168, 12);
  });

  it("velocity ↔ slowness and every unit round trip returns the value to 1e-12", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e5, noNaN: true }),
        fc.constantFrom(...(Object.keys(VELOCITY_UNITS) as (keyof typeof VELOCITY_UNITS)[])),
        fc.constantFrom(...(Object.keys(SLOWNESS_UNITS) as (keyof typeof SLOWNESS_UNITS)[])),
        fc.constantFrom(...(Object.keys(MODULUS_UNITS) as (keyof typeof MODULUS_UNITS)[])),
        (value, velocityUnit, slownessUnit, modulusUnit) => {
          const ms = velocityToMetresPerSecond(value, velocityUnit);
          expect(relativeError(metresPerSecondToVelocity(ms, velocityUnit), value)).toBeLessThan(1e-12);
          const dt = metresPerSecondToSlowness(ms, slownessUnit);
          expect(relativeError(slownessToMetresPerSecond(dt, slownessUnit), ms)).toBeLessThan(1e-12);
          expect(relativeError(pascalsToModulus(modulusToPascals(value, modulusUnit), modulusUnit), value)).toBeLessThan(1e-12);
        },
      ),
    );
  });
});
