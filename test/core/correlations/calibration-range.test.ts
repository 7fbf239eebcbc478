import { describe, expect, it } from "vitest";
import { BOUND_TOLERANCE, isOutsideRange } from "../../../core/correlations/calibration-range.js";

describe("isOutsideRange", () => {
  const range = { min: 10, max: 300 };

  it("counts both bounds as inside and values just beyond them as outside", () => {
    expect(isOutsideRange(10, range)).toBe(false);
    expect(isOutsideRange(300, range)).toBe(false);
    expect(isOutsideRange(9.999, range)).toBe(true);
    expect(isOutsideRange(300.001, range)).toBe(true);
  });

  it("does not flag a bound reached through a unit conversion's rounding (8 Mpsi → Pa → Mpsi; NIST SP 811 psi)", () => {
    const paPerMpsi = 6894.757293168362e6;
    const roundTripped = (8 * paPerMpsi) / (6894.757293168362 * 1e6);
    expect(Math.abs(roundTripped - 8)).toBeLessThan(8 * BOUND_TOLERANCE);
    expect(isOutsideRange(roundTripped, { min: 1, max: 8 })).toBe(false);
  });

  it("never flags NaN, a missing range, or a value on an open side", () => {
    expect(isOutsideRange(NaN, range)).toBe(false);
    expect(isOutsideRange(1e9, undefined)).toBe(false);
    expect(isOutsideRange(1e9, { min: 15, max: Infinity })).toBe(false);
    expect(isOutsideRange(-1e9, { min: -Infinity, max: 15 })).toBe(false);
    expect(isOutsideRange(14, { min: 15, max: Infinity })).toBe(true);
  });
});
