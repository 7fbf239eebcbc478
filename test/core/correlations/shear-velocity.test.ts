import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findCorrelation } from "../../../core/correlations/catalogue.js";
import type { Correlation } from "../../../core/correlations/correlation.js";

const entry = (id: string): Correlation => {
  const correlation = findCorrelation(id);
  if (correlation === undefined) throw new Error(`${id} is not in the catalogue`);
  return correlation;
};
const vpKmPerS = (...km: number[]) => ({ vpMetresPerSecond: Float64Array.from(km, (k) => k * 1000) });

describe("vs.castagna1985", () => {
  it("solves the mudrock line Vp = 1.16·Vs + 1.36 (km/s) for Vs and reports m/s (Castagna, Batzle & Eastwood 1985, Geophysics 50, 571–581; SEG Wiki)", () => {
    const { values } = entry("vs.castagna1985").evaluate(vpKmPerS(3, 4.5));
    // (3 − 1.36)/1.16 = 1.64/1.16 = 1.413793 km/s
    expect(values[0]).toBeCloseTo(1413.793, 2);
    // (4.5 − 1.36)/1.16 = 3.14/1.16 = 2.706897 km/s
    expect(values[1]).toBeCloseTo(2706.897, 2);
  });

  it("the predicted Vs put back into the mudrock line returns the Vp given, for random Vp (Castagna et al. 1985)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1500, max: 7000, noNaN: true }), (vp) => {
        const vs = entry("vs.castagna1985").evaluate({ vpMetresPerSecond: Float64Array.of(vp) }).values[0];
        return Math.abs(1.16 * (vs / 1000) + 1.36 - vp / 1000) < 1e-12;
      }),
    );
  });
});

describe("vs.greenberg1992_*", () => {
  it("sandstone Vs = 0.80416·Vp − 0.85588 in km/s (Greenberg & Castagna 1992, from memory)", () => {
    const { values } = entry("vs.greenberg1992_sandstone").evaluate(vpKmPerS(3, 4));
    // 2.41248 − 0.85588 = 1.5566 km/s; 3.21664 − 0.85588 = 2.36076 km/s
    expect(values[0]).toBeCloseTo(1556.6, 8);
    expect(values[1]).toBeCloseTo(2360.76, 8);
  });

  it("limestone Vs = −0.05508·Vp² + 1.01677·Vp − 1.03049 in km/s (Greenberg & Castagna 1992, from memory)", () => {
    const { values } = entry("vs.greenberg1992_limestone").evaluate(vpKmPerS(4, 6));
    // −0.05508·16 + 4.06708 − 1.03049 = −0.88128 + 3.03659 = 2.15531 km/s
    expect(values[0]).toBeCloseTo(2155.31, 8);
    // −0.05508·36 + 6.10062 − 1.03049 = −1.98288 + 5.07013 = 3.08725 km/s
    expect(values[1]).toBeCloseTo(3087.25, 8);
  });

  it("states each regression in its formula text with the coefficients it computes with (Greenberg & Castagna 1992, from memory)", () => {
    expect(entry("vs.greenberg1992_limestone").formula).toBe("Vs = −0.05508·Vp² + 1.01677·Vp − 1.03049 (velocities in km/s)");
    expect(entry("vs.greenberg1992_sandstone").formula).toBe("Vs = 0.80416·Vp − 0.85588 (velocities in km/s)");
  });

  it("dolomite Vs = 0.58321·Vp − 0.07775 in km/s (Greenberg & Castagna 1992, from memory)", () => {
    const { values } = entry("vs.greenberg1992_dolomite").evaluate(vpKmPerS(5, 6));
    // 2.91605 − 0.07775 = 2.8383 km/s; 3.49926 − 0.07775 = 3.42151 km/s
    expect(values[0]).toBeCloseTo(2838.3, 8);
    expect(values[1]).toBeCloseTo(3421.51, 8);
  });

  it("shale Vs = 0.76969·Vp − 0.86735 in km/s (Greenberg & Castagna 1992, from memory)", () => {
    const { values } = entry("vs.greenberg1992_shale").evaluate(vpKmPerS(2.5, 3));
    // 1.924225 − 0.86735 = 1.056875 km/s; 2.30907 − 0.86735 = 1.44172 km/s
    expect(values[0]).toBeCloseTo(1056.875, 8);
    expect(values[1]).toBeCloseTo(1441.72, 8);
  });
});

describe("vs.han1986", () => {
  it("Vs = 0.7936·Vp − 0.7868 in km/s (Han, Nur & Morgan 1986, commonly quoted form, from memory)", () => {
    const { values } = entry("vs.han1986").evaluate(vpKmPerS(3, 4));
    // 2.3808 − 0.7868 = 1.594 km/s; 3.1744 − 0.7868 = 2.3876 km/s
    expect(values[0]).toBeCloseTo(1594, 8);
    expect(values[1]).toBeCloseTo(2387.6, 8);
  });
});
