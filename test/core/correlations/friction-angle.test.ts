import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findCorrelation } from "../../../core/correlations/catalogue.js";

const lal = () => findCorrelation("friction_angle.lal1999")!;

describe("friction_angle.lal1999", () => {
  it("φ = asin((Vp − 1)/(Vp + 1)) in degrees with Vp in km/s, from Vp in m/s (Lal 1999, from memory of Chang et al. 2006)", () => {
    const { values } = lal().evaluate({ vpMetresPerSecond: Float64Array.of(2000, 3000) });
    // (2 − 1)/(2 + 1) = 1/3; asin(1/3) = 0.339837 rad = 19.4712°
    expect(values[0]).toBeCloseTo(19.4712, 4);
    // (3 − 1)/(3 + 1) = 0.5; asin(0.5) = 30° exactly
    expect(values[1]).toBeCloseTo(30, 10);
  });

  it("sin φ = (Vp − 1)/(Vp + 1) and φ lies in 0–90° for random Vp above 1 km/s (Lal 1999, from memory)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1000.001, max: 7000, noNaN: true }), (vp) => {
        const phi = lal().evaluate({ vpMetresPerSecond: Float64Array.of(vp) }).values[0];
        const km = vp / 1000;
        return phi > 0 && phi < 90 && Math.abs(Math.sin((phi * Math.PI) / 180) - (km - 1) / (km + 1)) < 1e-12;
      }),
    );
  });
});
