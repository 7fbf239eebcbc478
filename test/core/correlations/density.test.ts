import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findCorrelation } from "../../../core/correlations/catalogue.js";

const gardner = () => findCorrelation("density.gardner1974")!;
const vp = (...mps: number[]) => ({ vpMetresPerSecond: Float64Array.from(mps) });

describe("density.gardner1974", () => {
  it("ρ = 0.31·Vp^0.25 in g/cm3 with Vp in m/s (Gardner, Gardner & Gregory 1974)", () => {
    const { values } = gardner().evaluate(vp(2500, 4000));
    // 2500^0.25 = 7.07107; 0.31·7.07107 = 2.19203 g/cm3
    expect(values[0]).toBeCloseTo(2.19203, 5);
    // 4000^0.25 = 7.95271; 0.31·7.95271 = 2.46534 g/cm3
    expect(values[1]).toBeCloseTo(2.46534, 5);
  });

  it("agrees within 0.2 % with the published ft/s form ρ = 0.23·V^0.25 for random Vp (Gardner et al. 1974 via SEG Wiki; 1 ft = 0.3048 m)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1500, max: 6100, noNaN: true }), (mps) => {
        const rho = gardner().evaluate(vp(mps)).values[0];
        const fromFeet = 0.23 * (mps / 0.3048) ** 0.25;
        return Math.abs(rho / fromFeet - 1) < 0.002;
      }),
    );
  });

  it("flags Vp just outside 1500–6100 m/s but not at or just inside the bounds (range stated by Brocher 2005, from memory)", () => {
    const { outsideCalibration } = gardner().evaluate(vp(1499.9, 1500, 1500.1, 6099.9, 6100, 6100.1));
    expect([...outsideCalibration]).toEqual([1, 0, 0, 0, 0, 1]);
  });
});
