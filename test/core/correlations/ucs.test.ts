import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findCorrelation } from "../../../core/correlations/catalogue.js";
import type { Correlation } from "../../../core/correlations/correlation.js";

const entry = (id: string): Correlation => {
  const correlation = findCorrelation(id);
  if (correlation === undefined) throw new Error(`${id} is not in the catalogue`);
  return correlation;
};
/** Vp (m/s) of each compressional slowness Δt (µs/ft): Vp = 0.3048 m / (Δt·1e-6 s) = 304800/Δt (common practice). */
const slownessUsPerFt = (...dt: number[]) => ({ vpMetresPerSecond: Float64Array.from(dt, (t) => 304800 / t) });
const staticE = (...gpa: number[]) => ({ staticYoungsModulusPascals: Float64Array.from(gpa, (g) => g * 1e9) });

describe("UCS of sandstone", () => {
  it("ucs.mcnally1987: UCS = 1200·exp(−0.036·Δt), Δt derived from Vp (McNally 1987, as reproduced by Zhang 2019 and compiled by Chang et al. 2006)", () => {
    // Vp = 3048 m/s is Δt = 100 µs/ft exactly; Vp = 5000 m/s is Δt = 60.96 µs/ft
    const { values } = entry("ucs.mcnally1987").evaluate({ vpMetresPerSecond: Float64Array.of(3048, 5000) });
    // 1200·exp(−3.6) = 1200·0.0273237 = 32.7885 MPa
    expect(values[0]).toBeCloseTo(32.7885, 3);
    // 1200·exp(−0.036·60.96) = 1200·exp(−2.19456) = 1200·0.111408 = 133.689 MPa
    expect(values[1]).toBeCloseTo(133.689, 2);
  });

  it("ucs.bradford1998: UCS = 2.28 + 4.1089·E with static E in GPa (Bradford et al. 1998, as compiled by Chang et al. 2006, from memory)", () => {
    const { values } = entry("ucs.bradford1998").evaluate(staticE(10, 25));
    // 2.28 + 41.089 = 43.369 MPa
    expect(values[0]).toBeCloseTo(43.369, 10);
    // 2.28 + 102.7225 = 105.0025 MPa
    expect(values[1]).toBeCloseTo(105.0025, 10);
  });
});

describe("UCS of shale", () => {
  it("ucs.horsrud2001: UCS = 0.77·(304.8/Δt)^2.93 (Horsrud 2001, as reproduced by Mavko et al. table 7.14.2 and Zhang 2019)", () => {
    const { values } = entry("ucs.horsrud2001").evaluate(slownessUsPerFt(100, 152.4));
    // 304.8/100 = 3.048; 3.048^2.93 = 26.1917; 0.77·26.1917 = 20.1676 MPa
    expect(values[0]).toBeCloseTo(20.1676, 3);
    // 304.8/152.4 = 2; 2^2.93 = 7.62110; 0.77·7.62110 = 5.86825 MPa
    expect(values[1]).toBeCloseTo(5.86825, 4);
  });

  it("ucs.horsrud2001 in µs/ft equals its km/s form 0.77·Vp^2.93 for random Vp (Horsrud 2001, as reproduced by Zhang 2019, eqs 3.7 and 3.8)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1200, max: 6500, noNaN: true }), (vp) => {
        const ucs = entry("ucs.horsrud2001").evaluate({ vpMetresPerSecond: Float64Array.of(vp) }).values[0];
        return Math.abs(ucs / (0.77 * (vp / 1000) ** 2.93) - 1) < 1e-12;
      }),
    );
  });

  it("ucs.horsrud2001_modulus: UCS = 7.97·E^0.91 with static E in GPa (Horsrud 2001, as reproduced by Mavko et al. table 7.14.2)", () => {
    const { values } = entry("ucs.horsrud2001_modulus").evaluate(staticE(5, 10));
    // 5^0.91 = 4.32576; 7.97·4.32576 = 34.4763 MPa
    expect(values[0]).toBeCloseTo(34.4763, 3);
    // 10^0.91 = 8.12831; 7.97·8.12831 = 64.7826 MPa
    expect(values[1]).toBeCloseTo(64.7826, 3);
  });

  it("ucs.lal1999: UCS = 10·(304.8/Δt − 1) (Lal 1999, as reproduced by Mavko et al. table 7.14.2)", () => {
    const { values } = entry("ucs.lal1999").evaluate(slownessUsPerFt(152.4, 100));
    // 10·(2 − 1) = 10 MPa
    expect(values[0]).toBeCloseTo(10, 10);
    // 10·(3.048 − 1) = 20.48 MPa
    expect(values[1]).toBeCloseTo(20.48, 10);
  });
});

describe("UCS of carbonates", () => {
  it("ucs.militzer1973: UCS = (7682/Δt)^1.82 / 145 (Militzer & Stoll 1973, as reproduced by Mavko et al. table 7.14.3)", () => {
    const { values } = entry("ucs.militzer1973").evaluate(slownessUsPerFt(50, 76.2));
    // 7682/50 = 153.64; 153.64^1.82 = 9537.57; /145 = 65.7764 MPa
    expect(values[0]).toBeCloseTo(65.7764, 3);
    // 7682/76.2 = 100.814; 100.814^1.82 = 4430.02; /145 = 30.5518 MPa
    expect(values[1]).toBeCloseTo(30.5518, 3);
  });

  it("ucs.golubev1976: UCS = 10^(2.44 + 109.14/Δt) / 145 (Golubev & Rabinovich 1976, as reproduced by Mavko et al. table 7.14.3)", () => {
    const { values } = entry("ucs.golubev1976").evaluate(slownessUsPerFt(50, 76.2));
    // 2.44 + 109.14/50 = 4.6228; 10^4.6228 = 41956.6; /145 = 289.356 MPa
    expect(values[0]).toBeCloseTo(289.356, 2);
    // 2.44 + 109.14/76.2 = 3.872283; 10^3.872283 = 7452.18; /145 = 51.3944 MPa
    expect(values[1]).toBeCloseTo(51.3944, 3);
  });

  it("ucs.chang2006_limestone: UCS = 13.8·E^0.51 with static E in GPa (Chang et al. 2006, as reproduced by Mavko et al. table 7.14.3)", () => {
    const { values } = entry("ucs.chang2006_limestone").evaluate(staticE(20, 50));
    // 20^0.51 = 4.60813; 13.8·4.60813 = 63.5923 MPa
    expect(values[0]).toBeCloseTo(63.5923, 3);
    // 50^0.51 = 7.35317; 13.8·7.35317 = 101.474 MPa
    expect(values[1]).toBeCloseTo(101.474, 2);
  });

  it("ucs.chang2006_dolomite: UCS = 25.1·E^0.34 with static E in GPa (Chang et al. 2006, as reproduced by Mavko et al. table 7.14.3)", () => {
    const { values } = entry("ucs.chang2006_dolomite").evaluate(staticE(30, 60));
    // 30^0.34 = 3.17849; 25.1·3.17849 = 79.7802 MPa
    expect(values[0]).toBeCloseTo(79.7802, 3);
    // 60^0.34 = 4.02320; 25.1·4.02320 = 100.982 MPa
    expect(values[1]).toBeCloseTo(100.982, 2);
  });

  it("flags limestone predictions just outside 10–300 MPa and not just inside (Chang et al. 2006 limestone data range, Mavko et al. table 7.14.3)", () => {
    // E = (UCS/13.8)^(1/0.51): UCS 10 MPa at E = 0.531774 GPa, UCS 300 MPa at E = 418.835 GPa
    const atLow = (10 / 13.8) ** (1 / 0.51);
    const atHigh = (300 / 13.8) ** (1 / 0.51);
    const scale = 1e-4;
    const { values, outsideCalibration } = entry("ucs.chang2006_limestone").evaluate(
      staticE(atLow * (1 - scale), atLow * (1 + scale), atHigh * (1 - scale), atHigh * (1 + scale)),
    );
    expect(values[0]).toBeLessThan(10);
    expect(values[3]).toBeGreaterThan(300);
    expect([...outsideCalibration]).toEqual([1, 0, 0, 1]);
  });

  it("flags dolomite predictions just outside 60–100 MPa and not just inside (Chang et al. 2006 dolomite data range, Mavko et al. table 7.14.3)", () => {
    // UCS 60 MPa at E = (60/25.1)^(1/0.34) = 12.9768 GPa; 100 MPa at E = (100/25.1)^(1/0.34) = 58.2996 GPa
    const atLow = (60 / 25.1) ** (1 / 0.34);
    const atHigh = (100 / 25.1) ** (1 / 0.34);
    const scale = 1e-4;
    const { outsideCalibration } = entry("ucs.chang2006_dolomite").evaluate(
      staticE(atLow * (1 - scale), atLow * (1 + scale), atHigh * (1 - scale), atHigh * (1 + scale)),
    );
    expect([...outsideCalibration]).toEqual([1, 0, 0, 1]);
  });
});
